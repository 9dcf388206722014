-- A finding's estimate as a pulled row (shared/src/sync/finding-rows.ts): its values in a fixed order
-- without their keys, as JSON text the server writes with the estimate (server/src/findings/finding-input.ts).
-- A pull copies it instead of formatting the estimate's numbers again, and a phone parses about half
-- the bytes. Findings stored before this migration have no row and travel as their object until their
-- estimate is next written.
ALTER TABLE "findings" ADD COLUMN "estimate_row" text;
--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "estimate_row" SET COMPRESSION lz4;
--> statement-breakpoint
-- Whatever changes the estimate without writing its row in the same statement (a hand-written UPDATE,
-- a path added later) empties the row, so the pull sends that estimate as its object and never the row
-- of an older one.
CREATE FUNCTION finding_estimate_row_guard() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  NEW.estimate_row := NULL;
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER findings_estimate_row_guard BEFORE UPDATE OF estimate ON findings FOR EACH ROW
  WHEN (NEW.estimate IS DISTINCT FROM OLD.estimate AND NEW.estimate_row IS NOT DISTINCT FROM OLD.estimate_row)
  EXECUTE FUNCTION finding_estimate_row_guard();
