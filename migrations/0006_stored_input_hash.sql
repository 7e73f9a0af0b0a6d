DROP INDEX "analyses_study_idx";--> statement-breakpoint
ALTER TABLE "studies" ADD COLUMN "input_hash" text;--> statement-breakpoint
ALTER TABLE "studies" ADD COLUMN "included_count" integer;--> statement-breakpoint
CREATE INDEX "studies_lab_updated_idx" ON "studies" USING btree ("laboratory_id","updated_at");--> statement-breakpoint
CREATE INDEX "analyses_study_idx" ON "analyses" USING btree ("study_id","id");