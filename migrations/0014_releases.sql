CREATE TABLE "due_items" (
	"id" serial PRIMARY KEY NOT NULL,
	"laboratory_id" integer NOT NULL,
	"release_id" integer NOT NULL,
	"analyte_id" integer NOT NULL,
	"instrument_id" integer NOT NULL,
	"rule_key" text NOT NULL,
	"label" text NOT NULL,
	"rule" text DEFAULT '' NOT NULL,
	"due_date" text NOT NULL,
	"state" text DEFAULT 'open' NOT NULL,
	"started_release_id" integer,
	"started_study_id" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "due_reminders" (
	"laboratory_id" integer NOT NULL,
	"day" text NOT NULL,
	"items" integer NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "due_reminders_laboratory_id_day_pk" PRIMARY KEY("laboratory_id","day")
);
--> statement-breakpoint
CREATE TABLE "release_signatures" (
	"id" serial PRIMARY KEY NOT NULL,
	"laboratory_id" integer NOT NULL,
	"release_id" integer NOT NULL,
	"meaning" text NOT NULL,
	"signer_id" integer NOT NULL,
	"signer_name" text NOT NULL,
	"go_live_date" text,
	"comment" text DEFAULT '' NOT NULL,
	"signed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"content" jsonb NOT NULL,
	"content_hash" text NOT NULL,
	"verification_code" text NOT NULL,
	"pdf" "bytea",
	"pdf_sha256" text,
	"chain_length" bigint,
	"chain_head_hash" text
);
--> statement-breakpoint
CREATE TABLE "release_studies" (
	"id" serial PRIMARY KEY NOT NULL,
	"laboratory_id" integer NOT NULL,
	"release_id" integer NOT NULL,
	"study_id" integer NOT NULL,
	"requirement_key" text NOT NULL,
	"linked_by" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "release_templates" (
	"id" serial PRIMARY KEY NOT NULL,
	"laboratory_id" integer NOT NULL,
	"change_type" text NOT NULL,
	"requirements" jsonb NOT NULL,
	"due_rules" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" integer,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "release_waivers" (
	"id" serial PRIMARY KEY NOT NULL,
	"laboratory_id" integer NOT NULL,
	"release_id" integer NOT NULL,
	"requirement_key" text NOT NULL,
	"reason" text NOT NULL,
	"waived_by" integer NOT NULL,
	"waived_by_name" text NOT NULL,
	"waived_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "releases" (
	"id" serial PRIMARY KEY NOT NULL,
	"laboratory_id" integer NOT NULL,
	"change_type" text NOT NULL,
	"title" text NOT NULL,
	"analyte_id" integer NOT NULL,
	"instrument_id" integer NOT NULL,
	"comparative_instrument_id" integer,
	"reagent_lot" text DEFAULT '' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"requirements" jsonb NOT NULL,
	"due_rules" jsonb NOT NULL,
	"state" text DEFAULT 'open' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"signed_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "due_items" ADD CONSTRAINT "due_items_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "due_items" ADD CONSTRAINT "due_items_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "due_items" ADD CONSTRAINT "due_items_analyte_id_analytes_id_fk" FOREIGN KEY ("analyte_id") REFERENCES "public"."analytes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "due_items" ADD CONSTRAINT "due_items_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "due_reminders" ADD CONSTRAINT "due_reminders_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_signatures" ADD CONSTRAINT "release_signatures_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_signatures" ADD CONSTRAINT "release_signatures_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_signatures" ADD CONSTRAINT "release_signatures_signer_id_users_id_fk" FOREIGN KEY ("signer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_studies" ADD CONSTRAINT "release_studies_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_studies" ADD CONSTRAINT "release_studies_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_studies" ADD CONSTRAINT "release_studies_study_id_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."studies"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_studies" ADD CONSTRAINT "release_studies_linked_by_users_id_fk" FOREIGN KEY ("linked_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_templates" ADD CONSTRAINT "release_templates_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_templates" ADD CONSTRAINT "release_templates_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_waivers" ADD CONSTRAINT "release_waivers_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_waivers" ADD CONSTRAINT "release_waivers_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_waivers" ADD CONSTRAINT "release_waivers_waived_by_users_id_fk" FOREIGN KEY ("waived_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_laboratory_id_laboratories_id_fk" FOREIGN KEY ("laboratory_id") REFERENCES "public"."laboratories"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_analyte_id_analytes_id_fk" FOREIGN KEY ("analyte_id") REFERENCES "public"."analytes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_comparative_instrument_id_instruments_id_fk" FOREIGN KEY ("comparative_instrument_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "due_items_lab_state_idx" ON "due_items" USING btree ("laboratory_id","state","due_date");--> statement-breakpoint
CREATE INDEX "release_signatures_release_idx" ON "release_signatures" USING btree ("release_id","id");--> statement-breakpoint
CREATE UNIQUE INDEX "release_studies_study_key" ON "release_studies" USING btree ("study_id");--> statement-breakpoint
CREATE INDEX "release_studies_release_idx" ON "release_studies" USING btree ("release_id");--> statement-breakpoint
CREATE UNIQUE INDEX "release_templates_lab_type_key" ON "release_templates" USING btree ("laboratory_id","change_type");--> statement-breakpoint
CREATE UNIQUE INDEX "release_waivers_req_key" ON "release_waivers" USING btree ("release_id","requirement_key");--> statement-breakpoint
CREATE INDEX "releases_lab_state_idx" ON "releases" USING btree ("laboratory_id","state","updated_at");