-- Organisation isolation enforced by PostgreSQL: row-level security on every table holding an
-- organisation's data. The server's role (not the owner, no BYPASSRLS) sets `app.org_id` at the
-- start of each transaction (server/src/db/organisation-pool.ts); without it every organisation
-- table reads empty and refuses writes. FORCE makes the policies bind the tables' owner as well:
-- the migrating role needs BYPASSRLS (or superuser) for data fixes and the functions below.

-- The organisation of the current transaction; null (nothing visible) when unset.
CREATE FUNCTION app_current_organisation() RETURNS uuid LANGUAGE sql STABLE AS $$
  SELECT nullif(current_setting('app.org_id', true), '')::uuid
$$;
--> statement-breakpoint

-- Password-reset links were written without an organisation: give them the account's first one
-- (the organisation sign-in opens), so every e-mailed link belongs to exactly one organisation.
UPDATE email_tokens t SET organisation_id = (
  SELECT m.organisation_id FROM memberships m WHERE m.user_id = t.user_id ORDER BY m.created_at LIMIT 1)
WHERE t.organisation_id IS NULL;
--> statement-breakpoint
DELETE FROM email_tokens WHERE organisation_id IS NULL;
--> statement-breakpoint

-- Every table with an organisation_id column: one policy, for reads and writes alike.
DO $$
DECLARE t text;
BEGIN
  FOR t IN
    SELECT c.table_name FROM information_schema.columns c
    JOIN information_schema.tables tb ON tb.table_schema = c.table_schema AND tb.table_name = c.table_name
    WHERE c.table_schema = 'public' AND c.column_name = 'organisation_id' AND tb.table_type = 'BASE TABLE'
  LOOP
    EXECUTE format('ALTER TABLE %I ENABLE ROW LEVEL SECURITY', t);
    EXECUTE format('ALTER TABLE %I FORCE ROW LEVEL SECURITY', t);
    EXECUTE format('CREATE POLICY organisation_isolation ON %I
      USING (organisation_id = app_current_organisation())
      WITH CHECK (organisation_id = app_current_organisation())', t);
  END LOOP;
END $$;
--> statement-breakpoint

-- Built-in catalogue items (no organisation) are readable by everyone and writable by no organisation.
CREATE POLICY builtin_items_readable ON catalogue_items FOR SELECT USING (organisation_id IS NULL);
--> statement-breakpoint

-- The organisation's own row.
ALTER TABLE organisations ENABLE ROW LEVEL SECURITY;
--> statement-breakpoint
ALTER TABLE organisations FORCE ROW LEVEL SECURITY;
--> statement-breakpoint
CREATE POLICY organisation_isolation ON organisations
  USING (id = app_current_organisation())
  WITH CHECK (id = app_current_organisation());
--> statement-breakpoint

-- Site managers belong to the organisation of their site.
ALTER TABLE site_managers ENABLE ROW LEVEL SECURITY;
--> statement-breakpoint
ALTER TABLE site_managers FORCE ROW LEVEL SECURITY;
--> statement-breakpoint
CREATE POLICY organisation_isolation ON site_managers
  USING (EXISTS (SELECT 1 FROM sites s WHERE s.id = site_managers.site_id AND s.organisation_id = app_current_organisation()))
  WITH CHECK (EXISTS (SELECT 1 FROM sites s WHERE s.id = site_managers.site_id AND s.organisation_id = app_current_organisation()));
--> statement-breakpoint

-- A user is visible to the organisations they are a member of. Accounts are created by an
-- organisation's invitation before their membership row exists, hence the separate INSERT policy
-- (an e-mail already taken elsewhere then fails on the unique e-mail, telling nothing more).
ALTER TABLE users ENABLE ROW LEVEL SECURITY;
--> statement-breakpoint
ALTER TABLE users FORCE ROW LEVEL SECURITY;
--> statement-breakpoint
CREATE POLICY organisation_members ON users
  USING (EXISTS (SELECT 1 FROM memberships m WHERE m.user_id = users.id AND m.organisation_id = app_current_organisation()))
  WITH CHECK (EXISTS (SELECT 1 FROM memberships m WHERE m.user_id = users.id AND m.organisation_id = app_current_organisation()));
--> statement-breakpoint
CREATE POLICY new_accounts ON users FOR INSERT WITH CHECK (app_current_organisation() IS NOT NULL);
--> statement-breakpoint

-- The few look-ups that must cross organisations, each answering one narrow question. They run
-- as their owner (SECURITY DEFINER); the server then works inside the organisation they name.

-- Sign-in and password reset by e-mail: the organisation of the account's first membership.
CREATE FUNCTION auth_sign_in_organisation(p_email text) RETURNS uuid
  LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT m.organisation_id FROM users u JOIN memberships m ON m.user_id = u.id
  WHERE u.email = p_email ORDER BY m.created_at, m.organisation_id LIMIT 1
$$;
--> statement-breakpoint
-- Refresh and sign-out: the organisation of a refresh token, by its hash.
CREATE FUNCTION auth_refresh_token_organisation(p_token_hash text) RETURNS uuid
  LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT organisation_id FROM refresh_tokens WHERE token_hash = p_token_hash
$$;
--> statement-breakpoint
-- Invitation and reset links: the organisation of an e-mailed link, by its hash.
CREATE FUNCTION auth_email_token_organisation(p_token_hash text) RETURNS uuid
  LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT organisation_id FROM email_tokens WHERE token_hash = p_token_hash
$$;
--> statement-breakpoint
-- Photo ids come from phones: whether an id is already taken by any organisation.
CREATE FUNCTION photo_id_taken(p_id uuid) RETURNS boolean
  LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT EXISTS (SELECT 1 FROM photos WHERE id = p_id)
$$;
--> statement-breakpoint
-- Stored objects are shared by identical photos of every organisation: whether any row still uses one.
CREATE FUNCTION photo_content_in_use(p_content_hash text) RETURNS boolean
  LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT EXISTS (SELECT 1 FROM photos WHERE content_hash = p_content_hash)
$$;
--> statement-breakpoint
-- The daily digest's tick: every organisation's id, to visit each in its own scope.
CREATE FUNCTION digest_organisation_ids() RETURNS SETOF uuid
  LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT id FROM organisations ORDER BY id
$$;
--> statement-breakpoint
-- The daily purge, by age only, across organisations.
CREATE FUNCTION housekeeping_purge(p_sync_retention_days integer)
  RETURNS TABLE (refresh_tokens bigint, email_tokens bigint, sync_mutations bigint)
  LANGUAGE plpgsql VOLATILE SECURITY DEFINER SET search_path = public, pg_temp AS $$
DECLARE r bigint; e bigint; s bigint;
BEGIN
  DELETE FROM refresh_tokens WHERE expires_at < now();
  GET DIAGNOSTICS r = ROW_COUNT;
  DELETE FROM email_tokens WHERE expires_at < now() - interval '1 day' OR used_at < now() - interval '1 day';
  GET DIAGNOSTICS e = ROW_COUNT;
  DELETE FROM sync_mutations WHERE applied_at < now() - (p_sync_retention_days * interval '1 day');
  GET DIAGNOSTICS s = ROW_COUNT;
  RETURN QUERY SELECT r, e, s;
END $$;
--> statement-breakpoint

-- The versions the server has handed each phone belong to the organisation of that phone's client.
ALTER TABLE sync_client_versions ENABLE ROW LEVEL SECURITY;
--> statement-breakpoint
ALTER TABLE sync_client_versions FORCE ROW LEVEL SECURITY;
--> statement-breakpoint
CREATE POLICY organisation_isolation ON sync_client_versions
  USING (EXISTS (SELECT 1 FROM sync_clients c WHERE c.id = sync_client_versions.client_id AND c.organisation_id = app_current_organisation()))
  WITH CHECK (EXISTS (SELECT 1 FROM sync_clients c WHERE c.id = sync_client_versions.client_id AND c.organisation_id = app_current_organisation()));
