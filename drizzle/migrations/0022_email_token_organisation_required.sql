-- Every e-mailed link belongs to an organisation: migration 0017 filled it in (or removed links it
-- could not place), and every path that writes a link has set it since. The column now says so, so
-- a link can never fall outside row-level security. A link without one could not be opened anyway.
DELETE FROM "email_tokens" WHERE "organisation_id" IS NULL;
--> statement-breakpoint
ALTER TABLE "email_tokens" ALTER COLUMN "organisation_id" SET NOT NULL;
