ALTER TABLE "analyses" ADD COLUMN "purpose" text DEFAULT 'findings' NOT NULL;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_purpose_check" CHECK ("purpose" IN ('findings', 'plan'));
