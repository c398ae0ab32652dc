CREATE TABLE "canners" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"name" text NOT NULL,
	"inner_diameter_mm" double precision NOT NULL,
	"usable_height_mm" double precision NOT NULL,
	"rack_thickness_mm" double precision DEFAULT 6 NOT NULL,
	"gauge_type" text NOT NULL,
	"max_layers" integer DEFAULT 1 NOT NULL,
	"water_depth_mm" double precision DEFAULT 76 NOT NULL,
	"last_gauge_test_at" date,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "households" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"altitude_ft" integer DEFAULT 0 NOT NULL,
	"unit_system" text DEFAULT 'us' NOT NULL,
	"store_can_price_cents" integer DEFAULT 129 NOT NULL,
	"jar_uses" integer DEFAULT 10 NOT NULL,
	"cool_down_pint_minutes" integer DEFAULT 30 NOT NULL,
	"cool_down_quart_minutes" integer DEFAULT 45 NOT NULL,
	"best_by_months" integer DEFAULT 12 NOT NULL,
	"is_demo" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ingredients" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"form" text DEFAULT 'dry' NOT NULL,
	"grams_per_cup" double precision NOT NULL,
	"grams_per_cup_source" text NOT NULL,
	"expansion_ratio" double precision NOT NULL,
	"expansion_source" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "jar_sizes" (
	"id" text PRIMARY KEY NOT NULL,
	"size_key" text NOT NULL,
	"name" text NOT NULL,
	"capacity_ml" double precision NOT NULL,
	"capacity_source" text NOT NULL,
	"outside_diameter_mm" double precision NOT NULL,
	"height_mm" double precision NOT NULL,
	"dimensions_note" text NOT NULL,
	"mouth" text NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "jar_stock" (
	"household_id" uuid NOT NULL,
	"jar_size_id" text NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "jar_stock_household_id_jar_size_id_pk" PRIMARY KEY("household_id","jar_size_id")
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"user_id" uuid NOT NULL,
	"household_id" uuid NOT NULL,
	"role" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_user_id_household_id_pk" PRIMARY KEY("user_id","household_id")
);
--> statement-breakpoint
CREATE TABLE "price_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"household_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"label" text NOT NULL,
	"ingredient_id" text,
	"jar_size_id" text,
	"mouth" text,
	"package_grams" double precision,
	"package_ml" double precision,
	"pack_count" integer,
	"price_cents" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "recipe_jar_specs" (
	"recipe_id" text NOT NULL,
	"size_key" text NOT NULL,
	"dry_grams" double precision,
	"salt_tsp" double precision,
	"process_minutes" integer,
	CONSTRAINT "recipe_jar_specs_recipe_id_size_key_pk" PRIMARY KEY("recipe_id","size_key")
);
--> statement-breakpoint
CREATE TABLE "recipe_pressure_bands" (
	"recipe_id" text NOT NULL,
	"gauge_type" text NOT NULL,
	"min_ft" integer NOT NULL,
	"max_ft" integer NOT NULL,
	"psi" double precision NOT NULL,
	"source" text NOT NULL,
	CONSTRAINT "recipe_pressure_bands_recipe_id_gauge_type_min_ft_pk" PRIMARY KEY("recipe_id","gauge_type","min_ft")
);
--> statement-breakpoint
CREATE TABLE "recipes" (
	"id" text PRIMARY KEY NOT NULL,
	"household_id" uuid,
	"name" text NOT NULL,
	"status" text NOT NULL,
	"pack_style" text NOT NULL,
	"ingredient_id" text NOT NULL,
	"headspace_mm" double precision NOT NULL,
	"solids_fill_fraction" double precision NOT NULL,
	"fill_basis" text NOT NULL,
	"summary" text DEFAULT '' NOT NULL,
	"steps" text DEFAULT '' NOT NULL,
	"source" text NOT NULL,
	"caution" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text NOT NULL,
	"is_admin" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "canners" ADD CONSTRAINT "canners_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jar_stock" ADD CONSTRAINT "jar_stock_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jar_stock" ADD CONSTRAINT "jar_stock_jar_size_id_jar_sizes_id_fk" FOREIGN KEY ("jar_size_id") REFERENCES "public"."jar_sizes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "price_items" ADD CONSTRAINT "price_items_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "price_items" ADD CONSTRAINT "price_items_ingredient_id_ingredients_id_fk" FOREIGN KEY ("ingredient_id") REFERENCES "public"."ingredients"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "price_items" ADD CONSTRAINT "price_items_jar_size_id_jar_sizes_id_fk" FOREIGN KEY ("jar_size_id") REFERENCES "public"."jar_sizes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recipe_jar_specs" ADD CONSTRAINT "recipe_jar_specs_recipe_id_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."recipes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recipe_pressure_bands" ADD CONSTRAINT "recipe_pressure_bands_recipe_id_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."recipes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recipes" ADD CONSTRAINT "recipes_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recipes" ADD CONSTRAINT "recipes_ingredient_id_ingredients_id_fk" FOREIGN KEY ("ingredient_id") REFERENCES "public"."ingredients"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recipes" ADD CONSTRAINT "recipes_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "canners_household_idx" ON "canners" USING btree ("household_id");--> statement-breakpoint
CREATE INDEX "memberships_household_idx" ON "memberships" USING btree ("household_id");--> statement-breakpoint
CREATE INDEX "price_items_household_idx" ON "price_items" USING btree ("household_id");--> statement-breakpoint
CREATE INDEX "recipes_household_idx" ON "recipes" USING btree ("household_id");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_unique" ON "users" USING btree (lower("email"));