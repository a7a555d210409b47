ALTER TYPE "public"."activity_kind" ADD VALUE 'cut_released';--> statement-breakpoint
CREATE TABLE "cut_releases" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"layout_id" uuid NOT NULL,
	"version_number" integer NOT NULL,
	"reason" text NOT NULL,
	"released_by" text,
	"released_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cut_releases_version_uq" UNIQUE("layout_id","version_number")
);
--> statement-breakpoint
ALTER TABLE "cut_releases" ADD CONSTRAINT "cut_releases_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_releases" ADD CONSTRAINT "cut_releases_layout_id_layouts_id_fk" FOREIGN KEY ("layout_id") REFERENCES "public"."layouts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cut_releases" ADD CONSTRAINT "cut_releases_released_by_members_id_fk" FOREIGN KEY ("released_by") REFERENCES "public"."members"("id") ON DELETE set null ON UPDATE no action;