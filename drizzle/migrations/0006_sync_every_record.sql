CREATE TYPE "public"."sync_tombstone_reason" AS ENUM('deleted', 'archived', 'out-of-scope');--> statement-breakpoint
CREATE TABLE "sync_tombstones" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"user_id" uuid,
	"record_type" text NOT NULL,
	"record_id" text NOT NULL,
	"reason" "sync_tombstone_reason" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL,
	"sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL
);
--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "sites" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "sites" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "control_checks" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "control_checks" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "catalogue_items" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "catalogue_items" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "fixes" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "fixes" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "verifications" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "verifications" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "photos" ADD COLUMN "sync_xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "photos" ADD COLUMN "sync_seq" bigint DEFAULT nextval('sync_change_seq') NOT NULL;--> statement-breakpoint
ALTER TABLE "sync_tombstones" ADD CONSTRAINT "sync_tombstones_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_tombstones" ADD CONSTRAINT "sync_tombstones_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sync_tombstones_feed_idx" ON "sync_tombstones" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "scaffolds_feed_idx" ON "scaffolds" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "sites_feed_idx" ON "sites" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "control_checks_feed_idx" ON "control_checks" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "inspections_feed_idx" ON "inspections" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "catalogue_items_feed_idx" ON "catalogue_items" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "fixes_feed_idx" ON "fixes" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "fixes_finding_idx" ON "fixes" USING btree ("finding_id");--> statement-breakpoint
CREATE INDEX "verifications_feed_idx" ON "verifications" USING btree ("organisation_id","sync_xid","sync_seq");--> statement-breakpoint
CREATE INDEX "verifications_finding_idx" ON "verifications" USING btree ("finding_id");--> statement-breakpoint
CREATE INDEX "photos_feed_idx" ON "photos" USING btree ("organisation_id","sync_xid","sync_seq");