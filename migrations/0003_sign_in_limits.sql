CREATE TABLE "rate_limits" (
	"key" varchar(255) PRIMARY KEY NOT NULL,
	"points" integer DEFAULT 0 NOT NULL,
	"expire" bigint
);
--> statement-breakpoint
ALTER TABLE "sessions" ADD COLUMN "signed_in_at" timestamp with time zone DEFAULT now() NOT NULL;