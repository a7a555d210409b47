CREATE TYPE "public"."trace_stage" AS ENUM('waiting', 'reading', 'rectifying', 'separating', 'outlining', 'saving', 'finished');--> statement-breakpoint
CREATE TYPE "public"."trace_status" AS ENUM('queued', 'running', 'done', 'failed');--> statement-breakpoint
ALTER TYPE "public"."activity_kind" ADD VALUE 'outline_saved' BEFORE 'layout_created';--> statement-breakpoint
CREATE TABLE "trace_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"piece_id" uuid NOT NULL,
	"photo_id" uuid NOT NULL,
	"status" "trace_status" DEFAULT 'queued' NOT NULL,
	"stage" "trace_stage" DEFAULT 'waiting' NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"calibration" jsonb NOT NULL,
	"options" jsonb NOT NULL,
	"result" jsonb,
	"image_key" text,
	"message" text,
	"requested_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "pieces" ADD COLUMN "outline" jsonb;--> statement-breakpoint
ALTER TABLE "trace_runs" ADD CONSTRAINT "trace_runs_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trace_runs" ADD CONSTRAINT "trace_runs_piece_id_pieces_id_fk" FOREIGN KEY ("piece_id") REFERENCES "public"."pieces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trace_runs" ADD CONSTRAINT "trace_runs_photo_id_photos_id_fk" FOREIGN KEY ("photo_id") REFERENCES "public"."photos"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trace_runs" ADD CONSTRAINT "trace_runs_requested_by_members_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."members"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "trace_runs_piece_idx" ON "trace_runs" USING btree ("piece_id");