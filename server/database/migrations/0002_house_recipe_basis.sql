ALTER TABLE "recipes" ADD COLUMN "based_on_recipe_id" text;--> statement-breakpoint
ALTER TABLE "recipes" ADD COLUMN "caution_note" text;--> statement-breakpoint
ALTER TABLE "recipes" ADD CONSTRAINT "recipes_based_on_recipe_id_recipes_id_fk" FOREIGN KEY ("based_on_recipe_id") REFERENCES "public"."recipes"("id") ON DELETE no action ON UPDATE no action;