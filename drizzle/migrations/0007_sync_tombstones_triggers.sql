-- Tombstones for the change feed, written by the database in the transaction that deletes,
-- archives or moves a record out of someone's scope, so no writer (REST, sync push, a script)
-- can forget one. Rows are stamped by the table defaults (sync_xid, sync_seq) like every synced row.

-- A new stamp for rows whose scope grew (a new foreman or assignee must receive them).
CREATE FUNCTION sync_restamp_scaffold(scaffold uuid) RETURNS void LANGUAGE sql AS $$
  UPDATE scaffolds SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') WHERE id = scaffold;
  UPDATE sites SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq')
    WHERE id = (SELECT site_id FROM scaffolds WHERE id = scaffold);
  UPDATE inspections SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') WHERE scaffold_id = scaffold;
  UPDATE control_checks SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq')
    WHERE inspection_id IN (SELECT id FROM inspections WHERE scaffold_id = scaffold);
$$;
--> statement-breakpoint
CREATE FUNCTION sync_restamp_finding_children(finding uuid) RETURNS void LANGUAGE sql AS $$
  UPDATE fixes SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') WHERE finding_id = finding;
  UPDATE verifications SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') WHERE finding_id = finding;
  UPDATE photos SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq')
    WHERE (owner_type = 'finding' AND owner_id = finding)
       OR (owner_type = 'fix' AND owner_id IN (SELECT id FROM fixes WHERE finding_id = finding))
       OR (owner_type = 'verification' AND owner_id IN (SELECT id FROM verifications WHERE finding_id = finding));
$$;
--> statement-breakpoint
-- Skipped while the organisation (or the user) itself is being deleted: nobody is left to tell.
CREATE FUNCTION sync_tombstone(org uuid, target uuid, record_type text, record_id text, reason sync_tombstone_reason) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  IF NOT EXISTS (SELECT 1 FROM organisations WHERE id = org) THEN RETURN; END IF;
  IF target IS NOT NULL AND NOT EXISTS (SELECT 1 FROM users WHERE id = target) THEN RETURN; END IF;
  INSERT INTO sync_tombstones (organisation_id, user_id, record_type, record_id, reason) VALUES (org, target, record_type, record_id, reason);
END;
$$;
--> statement-breakpoint
CREATE FUNCTION sync_tombstone_on_delete() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.organisation_id IS NOT NULL THEN
    PERFORM sync_tombstone(OLD.organisation_id, NULL, TG_ARGV[0], OLD.id::text, 'deleted');
  END IF;
  RETURN OLD;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER sites_sync_tombstone AFTER DELETE ON sites FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('site');
--> statement-breakpoint
CREATE TRIGGER scaffolds_sync_tombstone AFTER DELETE ON scaffolds FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('scaffold');
--> statement-breakpoint
CREATE TRIGGER inspections_sync_tombstone AFTER DELETE ON inspections FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('inspection');
--> statement-breakpoint
CREATE TRIGGER control_checks_sync_tombstone AFTER DELETE ON control_checks FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('control-check');
--> statement-breakpoint
CREATE TRIGGER findings_sync_tombstone AFTER DELETE ON findings FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('finding');
--> statement-breakpoint
CREATE TRIGGER fixes_sync_tombstone AFTER DELETE ON fixes FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('fix');
--> statement-breakpoint
CREATE TRIGGER verifications_sync_tombstone AFTER DELETE ON verifications FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('verification');
--> statement-breakpoint
CREATE TRIGGER photos_sync_tombstone AFTER DELETE ON photos FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('photo');
--> statement-breakpoint
CREATE TRIGGER catalogue_items_sync_tombstone AFTER DELETE ON catalogue_items FOR EACH ROW EXECUTE FUNCTION sync_tombstone_on_delete('catalogue-item');
--> statement-breakpoint
-- A scaffold archived leaves every phone; a scaffold handed to another foreman leaves the old
-- foreman's phone (unless findings on it are still assigned to them) and reaches the new one's.
CREATE FUNCTION scaffolds_sync_scope() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  f record;
BEGIN
  IF OLD.archived_at IS NULL AND NEW.archived_at IS NOT NULL THEN
    PERFORM sync_tombstone(NEW.organisation_id, NULL, 'scaffold', NEW.id::text, 'archived');
  END IF;
  IF OLD.foreman_id IS DISTINCT FROM NEW.foreman_id THEN
    IF NEW.foreman_id IS NOT NULL THEN
      PERFORM sync_restamp_scaffold(NEW.id);
      FOR f IN SELECT id FROM findings WHERE scaffold_id = NEW.id LOOP
        UPDATE findings SET sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') WHERE id = f.id;
        PERFORM sync_restamp_finding_children(f.id);
      END LOOP;
    END IF;
    IF OLD.foreman_id IS NOT NULL THEN
      FOR f IN SELECT id FROM findings WHERE scaffold_id = NEW.id AND assignee_id IS DISTINCT FROM OLD.foreman_id LOOP
        PERFORM sync_tombstone(NEW.organisation_id, OLD.foreman_id, 'finding', f.id::text, 'out-of-scope');
      END LOOP;
      IF NOT EXISTS (SELECT 1 FROM findings WHERE scaffold_id = NEW.id AND assignee_id = OLD.foreman_id) THEN
        PERFORM sync_tombstone(NEW.organisation_id, OLD.foreman_id, 'scaffold', NEW.id::text, 'out-of-scope');
      END IF;
    END IF;
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER scaffolds_sync_scope AFTER UPDATE ON scaffolds FOR EACH ROW
  WHEN (OLD.archived_at IS DISTINCT FROM NEW.archived_at OR OLD.foreman_id IS DISTINCT FROM NEW.foreman_id)
  EXECUTE FUNCTION scaffolds_sync_scope();
--> statement-breakpoint
-- A finding assigned to someone else leaves the old assignee's phone (unless the scaffold is
-- theirs) and reaches the new one's with its scaffold, site, fixes, verifications and photos.
CREATE FUNCTION findings_sync_scope() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  scaffold_foreman uuid;
BEGIN
  SELECT foreman_id INTO scaffold_foreman FROM scaffolds WHERE id = NEW.scaffold_id;
  IF NEW.assignee_id IS NOT NULL THEN
    PERFORM sync_restamp_scaffold(NEW.scaffold_id);
    PERFORM sync_restamp_finding_children(NEW.id);
  END IF;
  IF OLD.assignee_id IS NOT NULL AND OLD.assignee_id IS DISTINCT FROM scaffold_foreman THEN
    PERFORM sync_tombstone(NEW.organisation_id, OLD.assignee_id, 'finding', NEW.id::text, 'out-of-scope');
    IF NOT EXISTS (SELECT 1 FROM findings WHERE scaffold_id = NEW.scaffold_id AND assignee_id = OLD.assignee_id) THEN
      PERFORM sync_tombstone(NEW.organisation_id, OLD.assignee_id, 'scaffold', NEW.scaffold_id::text, 'out-of-scope');
    END IF;
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER findings_sync_scope AFTER UPDATE ON findings FOR EACH ROW
  WHEN (OLD.assignee_id IS DISTINCT FROM NEW.assignee_id)
  EXECUTE FUNCTION findings_sync_scope();
--> statement-breakpoint
-- The conflict card names who wrote the replaced value and when: the user behind the replaced
-- writer's phone, and when that phone's last accepted change to the record was applied. Filled by
-- the database so every path that keeps a conflict records it the same way.
CREATE FUNCTION sync_conflicts_replaced_writer() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF NEW.replaced_client_id IS NOT NULL THEN
    IF NEW.replaced_user_id IS NULL THEN
      SELECT user_id INTO NEW.replaced_user_id FROM sync_clients WHERE id = NEW.replaced_client_id;
    END IF;
    IF NEW.replaced_at IS NULL THEN
      SELECT applied_at INTO NEW.replaced_at FROM sync_mutations
        WHERE client_id = NEW.replaced_client_id AND entity_id = NEW.entity_id AND outcome <> 'rejected'
        ORDER BY mutation_id DESC LIMIT 1;
    END IF;
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER sync_conflicts_replaced_writer BEFORE INSERT ON sync_conflicts FOR EACH ROW EXECUTE FUNCTION sync_conflicts_replaced_writer();
