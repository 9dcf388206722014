CREATE TABLE "digest_runs" (
	"organisation_id" uuid NOT NULL,
	"local_date" date NOT NULL,
	"queued_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "digest_runs_organisation_id_local_date_pk" PRIMARY KEY("organisation_id","local_date")
);
--> statement-breakpoint
ALTER TABLE "digest_runs" ADD CONSTRAINT "digest_runs_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;