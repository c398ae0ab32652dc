CREATE TABLE "dry_goods_stock" (
	"household_id" uuid NOT NULL,
	"ingredient_id" text NOT NULL,
	"grams" double precision DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "dry_goods_stock_household_id_ingredient_id_pk" PRIMARY KEY("household_id","ingredient_id")
);
--> statement-breakpoint
ALTER TABLE "households" ADD COLUMN "store_can_basis" text DEFAULT 'net' NOT NULL;--> statement-breakpoint
ALTER TABLE "households" ADD COLUMN "store_can_amount" double precision DEFAULT 425.243 NOT NULL;--> statement-breakpoint
ALTER TABLE "households" ADD COLUMN "currency" text DEFAULT 'USD' NOT NULL;--> statement-breakpoint
ALTER TABLE "market_checks" ADD COLUMN "state" text DEFAULT 'bought' NOT NULL;--> statement-breakpoint
ALTER TABLE "load_lines" ADD COLUMN "jars_from_stock" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "load_lines" ADD COLUMN "dry_grams_from_stock" double precision DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "shelf_movements" ADD COLUMN "kind" text DEFAULT 'taken' NOT NULL;--> statement-breakpoint
ALTER TABLE "shelf_movements" ADD COLUMN "reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "dry_goods_stock" ADD CONSTRAINT "dry_goods_stock_household_id_households_id_fk" FOREIGN KEY ("household_id") REFERENCES "public"."households"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dry_goods_stock" ADD CONSTRAINT "dry_goods_stock_ingredient_id_ingredients_id_fk" FOREIGN KEY ("ingredient_id") REFERENCES "public"."ingredients"("id") ON DELETE no action ON UPDATE no action;