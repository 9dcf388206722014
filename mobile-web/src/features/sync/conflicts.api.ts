import { SyncConflictSchema, type SyncConflict, type SyncConflictResolve } from '@plummet/shared';
import { authorisedFetch } from '../../api/authorised-fetch';

/** Settles a conflict on the server (needs a connection: the choice is checked against the finding as it is now). */
export async function resolveConflict(id: string, body: SyncConflictResolve): Promise<SyncConflict> {
  return SyncConflictSchema.parse(await authorisedFetch<unknown>(`/sync/conflicts/${id}/resolve`, { method: 'POST', body }));
}
