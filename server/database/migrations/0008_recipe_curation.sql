ALTER TABLE "reference_changes" ALTER COLUMN "version" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "recipes" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "recipes" ADD COLUMN "retired_reason" text;--> statement-breakpoint
ALTER TABLE "reference_changes" ADD COLUMN "changed_by" uuid;--> statement-breakpoint
ALTER TABLE "reference_changes" ADD COLUMN "reason" text;--> statement-breakpoint
ALTER TABLE "reference_changes" ADD COLUMN "source" text;--> statement-breakpoint
ALTER TABLE "reference_changes" ADD CONSTRAINT "reference_changes_changed_by_users_id_fk" FOREIGN KEY ("changed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reference_changes_recipe_idx" ON "reference_changes" USING btree ("recipe_id");