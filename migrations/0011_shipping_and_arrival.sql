ALTER TYPE "public"."activity_kind" ADD VALUE 'arrival_noted';--> statement-breakpoint
CREATE TABLE "arrival_notes" (
	"job_id" uuid PRIMARY KEY NOT NULL,
	"shop_id" uuid NOT NULL,
	"proof_id" uuid NOT NULL,
	"comment" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "arrival_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"proof_id" uuid NOT NULL,
	"original_key" text NOT NULL,
	"preview_key" text NOT NULL,
	"mime_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"showcase" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shipments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"carrier" text NOT NULL,
	"tracking_number" text NOT NULL,
	"tracking_url" text NOT NULL,
	"proof_id" uuid,
	"arrival_token_hash" text,
	"shipped_by" text,
	"shipped_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "shipments_arrival_token_hash_unique" UNIQUE("arrival_token_hash")
);
--> statement-breakpoint
ALTER TABLE "arrival_notes" ADD CONSTRAINT "arrival_notes_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "arrival_notes" ADD CONSTRAINT "arrival_notes_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "arrival_notes" ADD CONSTRAINT "arrival_notes_proof_id_proofs_id_fk" FOREIGN KEY ("proof_id") REFERENCES "public"."proofs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "arrival_photos" ADD CONSTRAINT "arrival_photos_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "arrival_photos" ADD CONSTRAINT "arrival_photos_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "arrival_photos" ADD CONSTRAINT "arrival_photos_proof_id_proofs_id_fk" FOREIGN KEY ("proof_id") REFERENCES "public"."proofs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shipments" ADD CONSTRAINT "shipments_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shipments" ADD CONSTRAINT "shipments_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shipments" ADD CONSTRAINT "shipments_proof_id_proofs_id_fk" FOREIGN KEY ("proof_id") REFERENCES "public"."proofs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shipments" ADD CONSTRAINT "shipments_shipped_by_members_id_fk" FOREIGN KEY ("shipped_by") REFERENCES "public"."members"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "arrival_photos_job_idx" ON "arrival_photos" USING btree ("job_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "arrival_photos_one_showcase_idx" ON "arrival_photos" USING btree ("job_id") WHERE "arrival_photos"."showcase";--> statement-breakpoint
CREATE UNIQUE INDEX "shipments_job_idx" ON "shipments" USING btree ("job_id");