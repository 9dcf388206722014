import { AsyncLocalStorage } from 'node:async_hooks';

/**
 * The organisation whose rows the current piece of work may see. PostgreSQL enforces it: every
 * transaction the data layer opens first runs `set_config('app.org_id', …, true)` with this value
 * (see organisation-pool.ts), and row-level security hides every other organisation's rows.
 *
 * Set once per request from the verified access token (OrganisationScopeInterceptor), per job by
 * the queue's workers, and by the few pre-authentication paths after a narrow look-up (sign-in by
 * e-mail, refresh token or e-mailed link by hash). Outside any scope nothing of an organisation
 * is visible, and nothing can be written.
 */
interface OrganisationScope {
  organisationId: string;
}

const storage = new AsyncLocalStorage<OrganisationScope>();
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isOrganisationId(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

/**
 * Runs `work` with the organisation set for every query it makes (and everything it awaits).
 * A Drizzle query runs when awaited, not when built: await it inside `work`.
 */
export function runInOrganisation<T>(organisationId: string, work: () => T): T {
  // Checked here so the value can never be anything but a uuid when it reaches SQL.
  if (!UUID.test(organisationId)) throw new Error(`not an organisation id: ${JSON.stringify(organisationId)}`);
  return storage.run({ organisationId: organisationId.toLowerCase() }, work);
}

/** The organisation of the current scope, if any. */
export function currentOrganisation(): string | undefined {
  return storage.getStore()?.organisationId;
}

/** The organisation of the current scope; throws when called outside one (a programming error). */
export function requireOrganisation(): string {
  const organisationId = currentOrganisation();
  if (!organisationId) throw new Error('No organisation is set for this work (runInOrganisation)');
  return organisationId;
}
