DROP INDEX "studies_lab_state_idx";--> statement-breakpoint
CREATE INDEX "studies_lab_state_updated_idx" ON "studies" USING btree ("laboratory_id","state","updated_at");--> statement-breakpoint
CREATE INDEX "studies_lab_author_state_idx" ON "studies" USING btree ("laboratory_id","created_by","state","updated_at");