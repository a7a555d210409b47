-- Trigram matching for the lists' "contains" searches; a trusted extension, so the database owner may add it.
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE INDEX "customers_shop_name_idx" ON "customers" USING btree ("shop_id","name","id");--> statement-breakpoint
CREATE INDEX "customers_name_trgm_idx" ON "customers" USING gin ("name" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "customers_email_trgm_idx" ON "customers" USING gin ("email" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "jobs_shop_due_order_idx" ON "jobs" USING btree ("shop_id",("due_date" is null),"due_date","created_at" DESC NULLS FIRST,"id");--> statement-breakpoint
CREATE INDEX "jobs_title_trgm_idx" ON "jobs" USING gin ("title" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "jobs_notes_trgm_idx" ON "jobs" USING gin ("notes" gin_trgm_ops);