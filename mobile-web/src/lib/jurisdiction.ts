import type { Jurisdiction } from '@plummet/shared';

/**
 * The jurisdiction a site works under, which picks the regulation references and pass criteria.
 * Sites from a server that does not send one yet read as UK.
 */
export function jurisdictionOf(site: { id: string; jurisdiction?: Jurisdiction | null } | null | undefined): Jurisdiction {
  return site?.jurisdiction ?? 'uk';
}
