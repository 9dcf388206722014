ALTER TABLE "scaffolds" ADD COLUMN "altered_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "made_safe_control" text;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "zone_radius_m" real;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "made_safe_photo_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "made_safe_until" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "hand_back" jsonb;--> statement-breakpoint
ALTER TABLE "fixes" ADD COLUMN "control" text;--> statement-breakpoint
ALTER TABLE "fixes" ADD COLUMN "photo_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "verifications" ADD COLUMN "photo_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD COLUMN "replaced_user_id" uuid;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD COLUMN "replaced_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD CONSTRAINT "sync_conflicts_replaced_user_id_users_id_fk" FOREIGN KEY ("replaced_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;