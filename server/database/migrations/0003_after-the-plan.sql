CREATE TABLE "canning_loads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"status" text DEFAULT 'done' NOT NULL,
	"plan_id" uuid,
	"plan_load_index" integer,
	"reprocess_of_id" uuid,
	"canner_id" uuid,
	"canner_name" text NOT NULL,
	"gauge_type" text NOT NULL,
	"altitude_ft" integer NOT NULL,
	"pressure_psi" double precision,
	"process_minutes" integer,
	"required_psi" double precision,
	"required_minutes" integer,
	"required_source" text,
	"started_at" timestamp with time zone,
	"ended_at" timestamp with time zone,
	"deadline_at" timestamp with time zone,
	"shortfall" jsonb,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fridge_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"load_id" uuid NOT NULL,
	"load_line_id" uuid NOT NULL,
	"product" text NOT NULL,
	"jar_size_id" text NOT NULL,
	"jars" integer NOT NULL,
	"refrigerated_at" timestamp with time zone NOT NULL,
	"cleared_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "load_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"load_id" uuid NOT NULL,
	"household_id" uuid NOT NULL,
	"line_index" integer NOT NULL,
	"recipe_id" text,
	"product" text NOT NULL,
	"jar_size_id" text NOT NULL,
	"jars" integer NOT NULL,
	"sealed" integer,
	"unsealed" integer,
	"unsealed_action" text
);
--> statement-breakpoint
CREATE TABLE "load_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"load_id" uuid NOT NULL,
	"storage_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"original_name" text DEFAULT '' NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"envelope_from" text DEFAULT '' NOT NULL,
	"envelope_to" jsonb NOT NULL,
	"subject" text DEFAULT '' NOT NULL,
	"text" text DEFAULT '' NOT NULL,
	"html" text,
	"raw" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reminders" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"load_id" uuid NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"sent_at" timestamp with time zone,
	"cancelled_at" timestamp with time zone,
	"recipients" jsonb,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "seal_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"load_id" uuid NOT NULL,
	"household_id" uuid NOT NULL,
	"checked_at" timestamp with time zone NOT NULL,
	"checked_by" uuid,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shelf_lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"load_id" uuid,
	"load_line_id" uuid,
	"recipe_id" text,
	"product" text NOT NULL,
	"jar_size_id" text NOT NULL,
	"load_code" text DEFAULT '' NOT NULL,
	"canned_on" date NOT NULL,
	"best_by" date NOT NULL,
	"jars_in" integer NOT NULL,
	"jars_left" integer NOT NULL,
	"source" text NOT NULL,
	"shelved_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shelf_movements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"batch_id" uuid NOT NULL,
	"lot_id" uuid NOT NULL,
	"jars" integer NOT NULL,
	"jars_returned" integer DEFAULT 0 NOT NULL,
	"moved_at" timestamp with time zone NOT NULL,
	"moved_by" uuid,
	"undone_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "canning_loads" ADD CONSTRAINT "canning_loads_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD CONSTRAINT "canning_loads_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD CONSTRAINT "canning_loads_reprocess_of_id_canning_loads_id_fk" FOREIGN KEY ("reprocess_of_id") REFERENCES "public"."canning_loads"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD CONSTRAINT "canning_loads_canner_id_canners_id_fk" FOREIGN KEY ("canner_id") REFERENCES "public"."canners"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "canning_loads" ADD CONSTRAINT "canning_loads_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fridge_items" ADD CONSTRAINT "fridge_items_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fridge_items" ADD CONSTRAINT "fridge_items_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fridge_items" ADD CONSTRAINT "fridge_items_load_line_id_load_lines_id_fk" FOREIGN KEY ("load_line_id") REFERENCES "public"."load_lines"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fridge_items" ADD CONSTRAINT "fridge_items_jar_size_id_jar_sizes_id_fk" FOREIGN KEY ("jar_size_id") REFERENCES "public"."jar_sizes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_lines" ADD CONSTRAINT "load_lines_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_lines" ADD CONSTRAINT "load_lines_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_lines" ADD CONSTRAINT "load_lines_recipe_id_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."recipes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_lines" ADD CONSTRAINT "load_lines_jar_size_id_jar_sizes_id_fk" FOREIGN KEY ("jar_size_id") REFERENCES "public"."jar_sizes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_photos" ADD CONSTRAINT "load_photos_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_photos" ADD CONSTRAINT "load_photos_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_photos" ADD CONSTRAINT "load_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminders" ADD CONSTRAINT "reminders_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminders" ADD CONSTRAINT "reminders_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seal_checks" ADD CONSTRAINT "seal_checks_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seal_checks" ADD CONSTRAINT "seal_checks_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seal_checks" ADD CONSTRAINT "seal_checks_checked_by_users_id_fk" FOREIGN KEY ("checked_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_lots" ADD CONSTRAINT "shelf_lots_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_lots" ADD CONSTRAINT "shelf_lots_load_id_canning_loads_id_fk" FOREIGN KEY ("load_id") REFERENCES "public"."canning_loads"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_lots" ADD CONSTRAINT "shelf_lots_load_line_id_load_lines_id_fk" FOREIGN KEY ("load_line_id") REFERENCES "public"."load_lines"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_lots" ADD CONSTRAINT "shelf_lots_recipe_id_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."recipes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_lots" ADD CONSTRAINT "shelf_lots_jar_size_id_jar_sizes_id_fk" FOREIGN KEY ("jar_size_id") REFERENCES "public"."jar_sizes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_movements" ADD CONSTRAINT "shelf_movements_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_movements" ADD CONSTRAINT "shelf_movements_lot_id_shelf_lots_id_fk" FOREIGN KEY ("lot_id") REFERENCES "public"."shelf_lots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_movements" ADD CONSTRAINT "shelf_movements_moved_by_users_id_fk" FOREIGN KEY ("moved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "canning_loads_number_unique" ON "canning_loads" USING btree ("household_id","number");--> statement-breakpoint
CREATE INDEX "canning_loads_household_started_idx" ON "canning_loads" USING btree ("household_id","started_at");--> statement-breakpoint
CREATE INDEX "canning_loads_plan_idx" ON "canning_loads" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "fridge_items_household_idx" ON "fridge_items" USING btree ("household_id");--> statement-breakpoint
CREATE INDEX "load_lines_load_idx" ON "load_lines" USING btree ("load_id");--> statement-breakpoint
CREATE INDEX "load_lines_household_recipe_idx" ON "load_lines" USING btree ("household_id","recipe_id");--> statement-breakpoint
CREATE INDEX "load_photos_load_idx" ON "load_photos" USING btree ("load_id");--> statement-breakpoint
CREATE INDEX "mail_outbox_received_idx" ON "mail_outbox" USING btree ("received_at");--> statement-breakpoint
CREATE UNIQUE INDEX "reminders_kind_load_unique" ON "reminders" USING btree ("kind","load_id");--> statement-breakpoint
CREATE INDEX "reminders_due_idx" ON "reminders" USING btree ("due_at");--> statement-breakpoint
CREATE UNIQUE INDEX "seal_checks_load_unique" ON "seal_checks" USING btree ("load_id");--> statement-breakpoint
CREATE INDEX "seal_checks_household_idx" ON "seal_checks" USING btree ("household_id");--> statement-breakpoint
CREATE INDEX "shelf_lots_household_fifo_idx" ON "shelf_lots" USING btree ("household_id","canned_on");--> statement-breakpoint
CREATE INDEX "shelf_movements_household_idx" ON "shelf_movements" USING btree ("household_id","moved_at");--> statement-breakpoint
CREATE INDEX "shelf_movements_batch_idx" ON "shelf_movements" USING btree ("batch_id");