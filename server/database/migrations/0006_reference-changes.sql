CREATE TABLE "reference_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version" integer NOT NULL,
	"recipe_id" text,
	"what" text NOT NULL,
	"applied_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "reference_changes_applied_idx" ON "reference_changes" USING btree ("applied_at");