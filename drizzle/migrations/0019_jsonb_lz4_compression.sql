-- The large jsonb values (an audit event's before/after records, a finding's estimate) are compressed
-- with lz4 instead of PostgreSQL's default pglz: cheaper to write and to read back, at a slightly
-- larger size. Needs a PostgreSQL built with lz4 (Debian's and the official images are); values
-- already stored keep their compression until rewritten.
ALTER TABLE "audit_events" ALTER COLUMN "before" SET COMPRESSION lz4, ALTER COLUMN "after" SET COMPRESSION lz4;
--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "estimate" SET COMPRESSION lz4;
