ALTER TABLE "studies" ADD COLUMN "returned_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "studies" ADD COLUMN "return_comment" text;--> statement-breakpoint
ALTER TABLE "studies" ADD COLUMN "plan_approved_at" timestamp with time zone;