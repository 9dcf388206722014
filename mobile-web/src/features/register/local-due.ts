/**
 * The due list from what the phone holds, for when there is no connection: the same shared rules
 * as the server's list, without the triggers (a scaffold closed by one shows as overdue, since its
 * inspection was made due when it was recorded).
 */
import {
  compareDue,
  dueState,
  effectiveRegime,
  isOnDueList,
  REGIME_REGULATION,
  type RegisterDueItem,
  suggestedReason,
} from '@plummet/shared';
import type { ScaffoldRecord, SiteRecord } from '../../local-db/records';

export function localDueItems(scaffolds: readonly ScaffoldRecord[], sites: readonly SiteRecord[], now: Date): RegisterDueItem[] {
  const siteById = new Map(sites.map((site) => [site.id, site]));
  const items: RegisterDueItem[] = [];
  for (const scaffold of scaffolds) {
    const site = siteById.get(scaffold.siteId);
    if (!site) continue;
    const regime = effectiveRegime(site.regime, scaffold.regime);
    const state = dueState(scaffold, null, now, site.timeZone);
    if (!isOnDueList(state)) continue;
    items.push({
      scaffoldId: scaffold.id,
      reference: scaffold.reference,
      siteId: site.id,
      siteName: site.name,
      status: scaffold.status,
      regime,
      regulation: REGIME_REGULATION[regime],
      state,
      nextDueAt: scaffold.nextDueAt,
      lastInspectedAt: scaffold.lastInspectedAt,
      trigger: null,
      suggestedReason: suggestedReason(null, scaffold.lastInspectedAt, regime),
    });
  }
  return items.sort(compareDue);
}
