-- findings.first_fixed_at is the earliest fixed_at of the finding's fixes, whatever path wrote them
-- (REST commands, a sync push applied set-based, data fixes). Statement triggers with transition
-- tables: one UPDATE per statement, however many fixes it wrote. A fix never moves to another finding.
CREATE FUNCTION findings_first_fix_refresh() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE findings f SET first_fixed_at = m.first_fixed_at
  FROM (
    SELECT c.finding_id, (SELECT min(x.fixed_at) FROM fixes x WHERE x.finding_id = c.finding_id) AS first_fixed_at
    FROM (SELECT DISTINCT finding_id FROM changed_fixes) c
  ) m
  WHERE f.id = m.finding_id AND f.first_fixed_at IS DISTINCT FROM m.first_fixed_at;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER fixes_first_fix_insert AFTER INSERT ON fixes REFERENCING NEW TABLE AS changed_fixes
  FOR EACH STATEMENT EXECUTE FUNCTION findings_first_fix_refresh();
--> statement-breakpoint
CREATE TRIGGER fixes_first_fix_update AFTER UPDATE ON fixes REFERENCING NEW TABLE AS changed_fixes
  FOR EACH STATEMENT EXECUTE FUNCTION findings_first_fix_refresh();
--> statement-breakpoint
CREATE TRIGGER fixes_first_fix_delete AFTER DELETE ON fixes REFERENCING OLD TABLE AS changed_fixes
  FOR EACH STATEMENT EXECUTE FUNCTION findings_first_fix_refresh();
--> statement-breakpoint
UPDATE findings f SET first_fixed_at = m.first_fixed_at
FROM (SELECT finding_id, min(fixed_at) AS first_fixed_at FROM fixes GROUP BY finding_id) m
WHERE f.id = m.finding_id;
