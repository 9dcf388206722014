ALTER TABLE "sync_conflicts" ADD COLUMN "replaced_user_id" uuid;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD COLUMN "replaced_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "sync_conflicts" ADD CONSTRAINT "sync_conflicts_replaced_user_id_users_id_fk" FOREIGN KEY ("replaced_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;