CREATE TYPE "public"."role" AS ENUM('inspector', 'foreman', 'manager', 'admin');--> statement-breakpoint
CREATE TYPE "public"."units" AS ENUM('si', 'imperial');--> statement-breakpoint
CREATE TYPE "public"."email_token_kind" AS ENUM('invite', 'password-reset');--> statement-breakpoint
CREATE TYPE "public"."inspection_regime" AS ENUM('7-day', 'pre-shift');--> statement-breakpoint
CREATE TYPE "public"."scaffold_status" AS ENUM('Safe to use', 'Restricted use', 'Do not use');--> statement-breakpoint
CREATE TYPE "public"."control" AS ENUM('toe-boards', 'brick-guards', 'netting-or-sheeting', 'fans-or-canopies', 'exclusion-zone-barriers', 'tool-tethering', 'material-storage');--> statement-breakpoint
CREATE TYPE "public"."control_result" AS ENUM('pass', 'fail', 'not-applicable');--> statement-breakpoint
CREATE TYPE "public"."inspection_reason" AS ENUM('scheduled', 'after-alteration', 'after-bad-weather', 'handover');--> statement-breakpoint
CREATE TYPE "public"."exposure" AS ENUM('public', 'hard-hats', 'zone-closed');--> statement-breakpoint
CREATE TYPE "public"."finding_state" AS ENUM('open', 'made-safe', 'fixed', 'verified');--> statement-breakpoint
CREATE TYPE "public"."risk_band" AS ENUM('Low', 'Medium', 'High');--> statement-breakpoint
CREATE TYPE "public"."verification_outcome" AS ENUM('verified', 'reopened');--> statement-breakpoint
CREATE TYPE "public"."photo_owner" AS ENUM('finding', 'control-check', 'fix', 'verification');--> statement-breakpoint
CREATE TYPE "public"."sync_conflict_status" AS ENUM('open', 'resolved');--> statement-breakpoint
CREATE TYPE "public"."sync_outcome" AS ENUM('applied', 'conflict', 'rejected');--> statement-breakpoint
CREATE SEQUENCE "public"."sync_change_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1;--> statement-breakpoint
CREATE TABLE "organisations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"slug" text NOT NULL,
	"settings" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "organisations_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"user_id" uuid NOT NULL,
	"organisation_id" uuid NOT NULL,
	"role" "role" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_user_id_organisation_id_pk" PRIMARY KEY("user_id","organisation_id")
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"position" text DEFAULT '' NOT NULL,
	"password_hash" text,
	"active" boolean DEFAULT true NOT NULL,
	"units" "units" DEFAULT 'si' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "email_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" "email_token_kind" NOT NULL,
	"user_id" uuid NOT NULL,
	"organisation_id" uuid,
	"role" "role",
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "email_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "rate_limits" (
	"key" text PRIMARY KEY NOT NULL,
	"count" integer NOT NULL,
	"reset_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "refresh_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"organisation_id" uuid NOT NULL,
	"family_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "refresh_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "scaffolds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"reference" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"elevations" text[] NOT NULL,
	"lifts" integer NOT NULL,
	"lift_height_m" real NOT NULL,
	"bays_per_elevation" integer NOT NULL,
	"status" "scaffold_status" DEFAULT 'Safe to use' NOT NULL,
	"foreman_id" uuid,
	"last_inspected_at" timestamp with time zone,
	"next_due_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sites" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"name" text NOT NULL,
	"address" text NOT NULL,
	"client_name" text NOT NULL,
	"time_zone" text DEFAULT 'Europe/London' NOT NULL,
	"regime" "inspection_regime" DEFAULT '7-day' NOT NULL,
	"report_recipients" text[] DEFAULT '{}' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "control_checks" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"inspection_id" uuid NOT NULL,
	"control" "control" NOT NULL,
	"result" "control_result" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	CONSTRAINT "control_checks_inspection_control_uq" UNIQUE("inspection_id","control")
);
--> statement-breakpoint
CREATE TABLE "inspections" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"scaffold_id" uuid NOT NULL,
	"inspector_id" uuid NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"finished_at" timestamp with time zone,
	"reason" "inspection_reason" NOT NULL,
	"wind_speed_mps" real,
	"report_for" text DEFAULT '' NOT NULL,
	"location" text DEFAULT '' NOT NULL,
	"equipment" text DEFAULT '' NOT NULL,
	"matters_giving_risk" text DEFAULT '' NOT NULL,
	"action_taken" text DEFAULT '' NOT NULL,
	"further_action" text DEFAULT '' NOT NULL,
	"reporter_name" text DEFAULT '' NOT NULL,
	"reporter_position" text DEFAULT '' NOT NULL,
	"signature" text,
	"signed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "catalogue_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid,
	"name" text NOT NULL,
	"category" text NOT NULL,
	"mass_kg" real NOT NULL,
	"shape" jsonb NOT NULL,
	"source" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "audit_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"actor_id" uuid,
	"entity_type" text NOT NULL,
	"entity_id" text NOT NULL,
	"action" text NOT NULL,
	"before" jsonb,
	"after" jsonb,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"inspection_id" uuid,
	"scaffold_id" uuid NOT NULL,
	"elevation" text NOT NULL,
	"lift" integer NOT NULL,
	"bay" integer NOT NULL,
	"height_m" real NOT NULL,
	"catalogue_item_id" uuid,
	"item_name" text NOT NULL,
	"mass_kg" real NOT NULL,
	"shape" jsonb,
	"exposure" "exposure" NOT NULL,
	"likelihood_answers" jsonb NOT NULL,
	"likelihood" integer NOT NULL,
	"estimate" jsonb NOT NULL,
	"severity" integer NOT NULL,
	"risk_score" integer NOT NULL,
	"risk_band" "risk_band" NOT NULL,
	"state" "finding_state" DEFAULT 'open' NOT NULL,
	"assignee_id" uuid,
	"due_at" timestamp with time zone,
	"notes" text DEFAULT '' NOT NULL,
	"made_safe_note" text,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL,
	"sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL,
	"sync_fields" jsonb DEFAULT '{}'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fixes" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"finding_id" uuid NOT NULL,
	"fixed_by" uuid NOT NULL,
	"fixed_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "verifications" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"finding_id" uuid NOT NULL,
	"verified_by" uuid NOT NULL,
	"verified_at" timestamp with time zone NOT NULL,
	"outcome" "verification_outcome" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"owner_type" "photo_owner" NOT NULL,
	"owner_id" uuid NOT NULL,
	"content_hash" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"media_type" text NOT NULL,
	"width" integer,
	"height" integer,
	"storage_key" text NOT NULL,
	"thumbnail_key" text NOT NULL,
	"taken_at" timestamp with time zone,
	"uploaded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sync_clients" (
	"id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"last_mutation_id" bigint DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_push_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "sync_conflicts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"entity" text NOT NULL,
	"entity_id" uuid NOT NULL,
	"field" text NOT NULL,
	"current_value" jsonb,
	"replaced_value" jsonb,
	"replaced_version" integer NOT NULL,
	"replaced_client_id" uuid,
	"winner_client_id" uuid NOT NULL,
	"winner_user_id" uuid,
	"mutation_id" bigint NOT NULL,
	"status" "sync_conflict_status" DEFAULT 'open' NOT NULL,
	"resolution" text,
	"resolved_by" uuid,
	"resolved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL,
	"sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sync_mutations" (
	"client_id" uuid NOT NULL,
	"mutation_id" bigint NOT NULL,
	"organisation_id" uuid NOT NULL,
	"entity" text NOT NULL,
	"entity_id" uuid NOT NULL,
	"action" text NOT NULL,
	"outcome" "sync_outcome" NOT NULL,
	"reason" text,
	"applied_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sync_mutations_client_id_mutation_id_pk" PRIMARY KEY("client_id","mutation_id")
);
--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "email_tokens" ADD CONSTRAINT "email_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "email_tokens" ADD CONSTRAINT "email_tokens_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refresh_tokens" ADD CONSTRAINT "refresh_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refresh_tokens" ADD CONSTRAINT "refresh_tokens_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD CONSTRAINT "scaffolds_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD CONSTRAINT "scaffolds_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD CONSTRAINT "scaffolds_foreman_id_users_id_fk" FOREIGN KEY ("foreman_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sites" ADD CONSTRAINT "sites_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "control_checks" ADD CONSTRAINT "control_checks_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "control_checks" ADD CONSTRAINT "control_checks_inspection_id_inspections_id_fk" FOREIGN KEY ("inspection_id") REFERENCES "public"."inspections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_scaffold_id_scaffolds_id_fk" FOREIGN KEY ("scaffold_id") REFERENCES "public"."scaffolds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_inspector_id_users_id_fk" FOREIGN KEY ("inspector_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_items" ADD CONSTRAINT "catalogue_items_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_inspection_id_inspections_id_fk" FOREIGN KEY ("inspection_id") REFERENCES "public"."inspections"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_scaffold_id_scaffolds_id_fk" FOREIGN KEY ("scaffold_id") REFERENCES "public"."scaffolds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_catalogue_item_id_catalogue_items_id_fk" FOREIGN KEY ("catalogue_item_id") REFERENCES "public"."catalogue_items"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_assignee_id_users_id_fk" FOREIGN KEY ("assignee_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fixes" ADD CONSTRAINT "fixes_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fixes" ADD CONSTRAINT "fixes_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fixes" ADD CONSTRAINT "fixes_fixed_by_users_id_fk" FOREIGN KEY ("fixed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verifications" ADD CONSTRAINT "verifications_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verifications" ADD CONSTRAINT "verifications_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verifications" ADD CONSTRAINT "verifications_verified_by_users_id_fk" FOREIGN KEY ("verified_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_clients" ADD CONSTRAINT "sync_clients_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_clients" ADD CONSTRAINT "sync_clients_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD CONSTRAINT "sync_conflicts_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD CONSTRAINT "sync_conflicts_winner_user_id_users_id_fk" FOREIGN KEY ("winner_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD CONSTRAINT "sync_conflicts_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_mutations" ADD CONSTRAINT "sync_mutations_client_id_sync_clients_id_fk" FOREIGN KEY ("client_id") REFERENCES "public"."sync_clients"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_mutations" ADD CONSTRAINT "sync_mutations_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "refresh_tokens_family_idx" ON "refresh_tokens" USING btree ("family_id");--> statement-breakpoint
CREATE INDEX "scaffolds_org_site_idx" ON "scaffolds" USING btree ("organisation_id","site_id");--> statement-breakpoint
CREATE INDEX "scaffolds_foreman_idx" ON "scaffolds" USING btree ("foreman_id");--> statement-breakpoint
CREATE INDEX "sites_org_idx" ON "sites" USING btree ("organisation_id");--> statement-breakpoint
CREATE INDEX "inspections_org_scaffold_idx" ON "inspections" USING btree ("organisation_id","scaffold_id");--> statement-breakpoint
CREATE INDEX "catalogue_items_org_idx" ON "catalogue_items" USING btree ("organisation_id");--> statement-breakpoint
CREATE INDEX "audit_events_org_entity_idx" ON "audit_events" USING btree ("organisation_id","entity_type","entity_id");--> statement-breakpoint
CREATE INDEX "findings_feed_idx" ON "findings" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "findings_org_scaffold_idx" ON "findings" USING btree ("organisation_id","scaffold_id");--> statement-breakpoint
CREATE INDEX "findings_org_state_risk_idx" ON "findings" USING btree ("organisation_id","state","risk_score");--> statement-breakpoint
CREATE INDEX "findings_org_risk_id_idx" ON "findings" USING btree ("organisation_id","risk_score","id");--> statement-breakpoint
CREATE INDEX "findings_assignee_idx" ON "findings" USING btree ("assignee_id");--> statement-breakpoint
CREATE INDEX "photos_owner_idx" ON "photos" USING btree ("owner_type","owner_id");--> statement-breakpoint
CREATE INDEX "photos_hash_idx" ON "photos" USING btree ("content_hash");--> statement-breakpoint
CREATE INDEX "sync_conflicts_org_status_idx" ON "sync_conflicts" USING btree ("organisation_id","status");--> statement-breakpoint
CREATE INDEX "sync_conflicts_feed_idx" ON "sync_conflicts" USING btree ("organisation_id","sync_xid","sync_seq");