ALTER TYPE "public"."activity_kind" ADD VALUE 'quote_built';--> statement-breakpoint
ALTER TABLE "quotes" ADD COLUMN "terms" jsonb;--> statement-breakpoint
ALTER TABLE "quotes" ADD COLUMN "basis" jsonb;--> statement-breakpoint
ALTER TABLE "quotes" ADD COLUMN "sent_at" timestamp with time zone;