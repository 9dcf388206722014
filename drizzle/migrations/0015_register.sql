CREATE TYPE "public"."scaffold_trigger_kind" AS ENUM('altered', 'adverse-weather');--> statement-breakpoint
ALTER TYPE "public"."control" ADD VALUE 'chutes-and-lowering';--> statement-breakpoint
ALTER TYPE "public"."control" ADD VALUE 'loading-bay-gates';--> statement-breakpoint
ALTER TYPE "public"."control" ADD VALUE 'guardrail-mesh';--> statement-breakpoint
ALTER TYPE "public"."inspection_reason" ADD VALUE 'pre-shift';--> statement-breakpoint
CREATE TABLE "exclusion_zones" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"scaffold_id" uuid NOT NULL,
	"elevation" text NOT NULL,
	"heaviest_item_id" uuid,
	"limiting_wind_mps" real,
	"barriered_width_m" real,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	CONSTRAINT "exclusion_zones_scaffold_elevation_uq" UNIQUE("scaffold_id","elevation")
);
--> statement-breakpoint
CREATE TABLE "scaffold_triggers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"scaffold_id" uuid NOT NULL,
	"kind" "scaffold_trigger_kind" NOT NULL,
	"note" text NOT NULL,
	"recorded_by" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"answered_by" uuid
);
--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "tag_status" "scaffold_status";--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "restriction" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "access_tags_changed" boolean;--> statement-breakpoint
ALTER TABLE "exclusion_zones" ADD CONSTRAINT "exclusion_zones_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "exclusion_zones" ADD CONSTRAINT "exclusion_zones_scaffold_id_scaffolds_id_fk" FOREIGN KEY ("scaffold_id") REFERENCES "public"."scaffolds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "exclusion_zones" ADD CONSTRAINT "exclusion_zones_heaviest_item_id_catalogue_items_id_fk" FOREIGN KEY ("heaviest_item_id") REFERENCES "public"."catalogue_items"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffold_triggers" ADD CONSTRAINT "scaffold_triggers_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffold_triggers" ADD CONSTRAINT "scaffold_triggers_scaffold_id_scaffolds_id_fk" FOREIGN KEY ("scaffold_id") REFERENCES "public"."scaffolds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffold_triggers" ADD CONSTRAINT "scaffold_triggers_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scaffold_triggers" ADD CONSTRAINT "scaffold_triggers_answered_by_inspections_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."inspections"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "exclusion_zones_org_idx" ON "exclusion_zones" USING btree ("organisation_id");--> statement-breakpoint
CREATE INDEX "scaffold_triggers_waiting_idx" ON "scaffold_triggers" USING btree ("organisation_id","scaffold_id","answered_by");