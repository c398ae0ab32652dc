CREATE TABLE "rate_limits" (
	"key" text PRIMARY KEY NOT NULL,
	"points" integer NOT NULL,
	"expire" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "test_clock" (
	"name" text PRIMARY KEY NOT NULL,
	"offset_ms" bigint NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
