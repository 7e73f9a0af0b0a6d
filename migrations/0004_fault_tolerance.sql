CREATE TABLE "audit_chain_heads" (
	"chain" text PRIMARY KEY NOT NULL,
	"laboratory_id" integer,
	"length" bigint NOT NULL,
	"head_id" bigint NOT NULL,
	"head_hash" text NOT NULL,
	"key_id" text NOT NULL,
	"mac" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "audit_checkpoints" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"chain" text NOT NULL,
	"laboratory_id" integer,
	"length" bigint NOT NULL,
	"head_id" bigint NOT NULL,
	"head_hash" text NOT NULL,
	"at" timestamp with time zone NOT NULL,
	"reason" text NOT NULL,
	"key_id" text NOT NULL,
	"mac" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_limits" (
	"key" varchar(255) PRIMARY KEY NOT NULL,
	"points" integer DEFAULT 0 NOT NULL,
	"expire" bigint
);
--> statement-breakpoint
DROP INDEX "users_email_key";--> statement-breakpoint
ALTER TABLE "analyses" ADD COLUMN "attempt" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "analyses" ADD COLUMN "heartbeat_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "audit_events" ADD COLUMN "key_id" text;--> statement-breakpoint
ALTER TABLE "signatures" ADD COLUMN "chain_length" bigint;--> statement-breakpoint
ALTER TABLE "signatures" ADD COLUMN "chain_head_hash" text;--> statement-breakpoint
CREATE INDEX "audit_checkpoints_chain_idx" ON "audit_checkpoints" USING btree ("chain","id");--> statement-breakpoint
CREATE INDEX "analyses_state_idx" ON "analyses" USING btree ("state");--> statement-breakpoint
CREATE UNIQUE INDEX "users_lab_email_key" ON "users" USING btree ("laboratory_id","email");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_key" ON "users" USING btree ("email") WHERE password_hash IS NOT NULL;--> statement-breakpoint
ALTER TABLE "specimens" ADD CONSTRAINT "specimens_comparative_finite" CHECK ("specimens"."comparative" IS NULL OR ("specimens"."comparative" <> 'Infinity'::float8 AND "specimens"."comparative" <> '-Infinity'::float8 AND "specimens"."comparative" <> 'NaN'::float8)) NOT VALID;--> statement-breakpoint
ALTER TABLE "specimens" ADD CONSTRAINT "specimens_candidate_finite" CHECK ("specimens"."candidate" IS NULL OR ("specimens"."candidate" <> 'Infinity'::float8 AND "specimens"."candidate" <> '-Infinity'::float8 AND "specimens"."candidate" <> 'NaN'::float8)) NOT VALID;--> statement-breakpoint
ALTER TABLE "specimens" ADD CONSTRAINT "specimens_value_finite" CHECK ("specimens"."value" IS NULL OR ("specimens"."value" <> 'Infinity'::float8 AND "specimens"."value" <> '-Infinity'::float8 AND "specimens"."value" <> 'NaN'::float8)) NOT VALID;