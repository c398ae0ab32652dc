CREATE TABLE "canning_days" (
	"plan_id" uuid PRIMARY KEY NOT NULL,
	"household_id" uuid NOT NULL,
	"snapshot" jsonb NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"started_by" uuid
);
--> statement-breakpoint
CREATE TABLE "day_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plan_id" uuid NOT NULL,
	"household_id" uuid NOT NULL,
	"seq" bigint GENERATED ALWAYS AS IDENTITY (sequence name "day_events_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"target" text NOT NULL,
	"kind" text NOT NULL,
	"at" timestamp with time zone NOT NULL,
	"undoes" uuid,
	"client_id" text NOT NULL,
	"by_user" uuid,
	"load_id" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "vent_started_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "pressure_reached_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "process_started_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "process_ended_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "pressure_drops" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "confirmed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD COLUMN "confirmed_by" uuid;--> statement-breakpoint
ALTER TABLE "canning_days" ADD CONSTRAINT "canning_days_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "canning_days" ADD CONSTRAINT "canning_days_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "canning_days" ADD CONSTRAINT "canning_days_started_by_users_id_fk" FOREIGN KEY ("started_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "day_events" ADD CONSTRAINT "day_events_plan_id_canning_days_plan_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."canning_days"("plan_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "day_events" ADD CONSTRAINT "day_events_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "day_events" ADD CONSTRAINT "day_events_by_user_users_id_fk" FOREIGN KEY ("by_user") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "day_events" ADD CONSTRAINT "day_events_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "canning_days_household_idx" ON "canning_days" USING btree ("household_id");--> statement-breakpoint
CREATE UNIQUE INDEX "day_events_client_unique" ON "day_events" USING btree ("plan_id","client_id");--> statement-breakpoint
CREATE INDEX "day_events_plan_seq_idx" ON "day_events" USING btree ("plan_id","seq");--> statement-breakpoint
ALTER TABLE "canning_loads" ADD CONSTRAINT "canning_loads_confirmed_by_users_id_fk" FOREIGN KEY ("confirmed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
-- Every load logged before the Canning day was logged by hand, so it is confirmed.
UPDATE "canning_loads" SET "confirmed_at" = "created_at";
