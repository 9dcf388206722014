CREATE TABLE "sync_client_versions" (
	"client_id" uuid NOT NULL,
	"record_id" uuid NOT NULL,
	"version" integer NOT NULL,
	CONSTRAINT "sync_client_versions_client_id_record_id_pk" PRIMARY KEY("client_id","record_id")
);
--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "version" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "sync_fields" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "control_checks" ADD COLUMN "sync_fields" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "sync_fields" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "sync_client_versions" ADD CONSTRAINT "sync_client_versions_client_id_sync_clients_id_fk" FOREIGN KEY ("client_id") REFERENCES "public"."sync_clients"("id") ON DELETE cascade ON UPDATE no action;