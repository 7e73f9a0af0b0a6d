ALTER TABLE "studies" ADD COLUMN "submission_note" text;--> statement-breakpoint
ALTER TABLE "studies" ADD COLUMN "submitted_by" integer;--> statement-breakpoint
ALTER TABLE "studies" ADD CONSTRAINT "studies_submitted_by_users_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;