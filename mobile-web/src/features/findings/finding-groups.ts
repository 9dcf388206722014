/** The findings list of a big site: search by item, grouped by scaffold and lift, highest risk first within a group. */
export interface GroupableFinding {
  id: string;
  scaffoldId: string;
  lift: number;
  riskScore: number;
  item: { name: string };
}

export type ListEntry<F> = { kind: 'heading'; key: string; text: string; count: number } | { kind: 'finding'; key: string; finding: F };

/** Findings whose item name contains every word of the search (case and accents ignored). */
export function matchesSearch(finding: GroupableFinding, search: string): boolean {
  const fold = (text: string) => text.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
  const name = fold(finding.item.name);
  return fold(search).split(/\s+/).filter(Boolean).every((word) => name.includes(word));
}

/**
 * One heading per scaffold and lift ("QL-A · lift 3 · 4 findings"), scaffolds in reference order
 * and lifts from the bottom up, each group's findings highest risk first.
 */
export function groupByScaffoldAndLift<F extends GroupableFinding>(findings: readonly F[], reference: (scaffoldId: string) => string): ListEntry<F>[] {
  const groups = new Map<string, F[]>();
  for (const finding of findings) {
    const key = `${finding.scaffoldId}|${finding.lift}`;
    const group = groups.get(key);
    if (group) group.push(finding);
    else groups.set(key, [finding]);
  }
  const ordered = [...groups.values()].sort((a, b) => {
    const byScaffold = reference(a[0]!.scaffoldId).localeCompare(reference(b[0]!.scaffoldId), 'en-GB', { numeric: true });
    return byScaffold || a[0]!.lift - b[0]!.lift;
  });
  return ordered.flatMap((group) => {
    const first = group[0]!;
    const heading: ListEntry<F> = {
      kind: 'heading',
      key: `heading-${first.scaffoldId}-${first.lift}`,
      text: `${reference(first.scaffoldId)} · lift ${first.lift}`,
      count: group.length,
    };
    const rows = [...group].sort((a, b) => b.riskScore - a.riskScore).map((finding): ListEntry<F> => ({ kind: 'finding', key: finding.id, finding }));
    return [heading, ...rows];
  });
}
