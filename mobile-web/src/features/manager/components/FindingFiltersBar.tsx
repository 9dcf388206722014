import { FINDING_STATE_SHORT, FINDING_STATES } from '@plummet/shared';
import type { FindingFilters } from '../finding-filters';
import { useMembers, useScaffolds, useSites } from '../manager.queries';

const BANDS = ['High', 'Medium', 'Low'];

function toggle(list: string[] | undefined, value: string, on: boolean): string[] | undefined {
  const next = on ? [...(list ?? []), value] : (list ?? []).filter((v) => v !== value);
  return next.length ? next : undefined;
}

/** Every filter of the findings table; each change goes straight to the page URL and the server. */
export function FindingFiltersBar({ filters, onChange }: { filters: FindingFilters; onChange: (next: FindingFilters) => void }) {
  const sites = useSites();
  const scaffolds = useScaffolds();
  const members = useMembers();
  const set = (patch: Partial<FindingFilters>) => onChange({ ...filters, ...patch });
  const scaffoldsOfSite = scaffolds.data?.filter((s) => !filters.siteId || s.siteId === filters.siteId) ?? [];

  return (
    <form className="manager-filters" role="search" aria-label="Filter findings" onSubmit={(e) => e.preventDefault()}>
      <label>
        Search item or note
        <input type="search" defaultValue={filters.q ?? ''} data-testid="filter-q" onKeyDown={(e) => {
          if (e.key === 'Enter') set({ q: e.currentTarget.value.trim() || undefined });
        }} onBlur={(e) => set({ q: e.currentTarget.value.trim() || undefined })} />
      </label>
      <label>
        Site
        <select value={filters.siteId ?? ''} data-testid="filter-site" onChange={(e) => set({ siteId: e.target.value || undefined, scaffoldId: undefined })}>
          <option value="">Every site</option>
          {sites.data?.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </select>
      </label>
      <label>
        Scaffold
        <select value={filters.scaffoldId ?? ''} data-testid="filter-scaffold" onChange={(e) => set({ scaffoldId: e.target.value || undefined })}>
          <option value="">Every scaffold</option>
          {scaffoldsOfSite.map((s) => <option key={s.id} value={s.id}>{s.reference}</option>)}
        </select>
      </label>
      <fieldset>
        <legend className="visually-hidden">Band</legend>
        {BANDS.map((band) => (
          <label key={band} style={{ flexDirection: 'row', alignItems: 'center' }}>
            <input type="checkbox" checked={filters.riskBand?.includes(band) ?? false} data-testid={`filter-band-${band}`}
              onChange={(e) => set({ riskBand: toggle(filters.riskBand, band, e.target.checked) })} />
            {band}
          </label>
        ))}
      </fieldset>
      <fieldset>
        <legend className="visually-hidden">State</legend>
        {FINDING_STATES.map((state) => (
          <label key={state} style={{ flexDirection: 'row', alignItems: 'center' }}>
            <input type="checkbox" checked={filters.state?.includes(state) ?? false} data-testid={`filter-state-${state}`}
              onChange={(e) => set({ state: toggle(filters.state, state, e.target.checked) })} />
            {FINDING_STATE_SHORT[state]}
          </label>
        ))}
      </fieldset>
      <label>
        Assignee
        <select value={filters.assigneeId ?? ''} data-testid="filter-assignee" onChange={(e) => set({ assigneeId: e.target.value || undefined })}>
          <option value="">Anyone</option>
          {members.data?.filter((m) => m.role === 'foreman').map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
        </select>
      </label>
      <label>
        Overdue
        <select value={filters.overdue === undefined ? '' : String(filters.overdue)} data-testid="filter-overdue"
          onChange={(e) => set({ overdue: e.target.value === '' ? undefined : e.target.value === 'true' })}>
          <option value="">Either</option>
          <option value="true">Overdue only</option>
          <option value="false">Not overdue</option>
        </select>
      </label>
      <label>
        Raised from
        <input type="date" value={filters.raisedFrom ?? ''} data-testid="filter-from" onChange={(e) => set({ raisedFrom: e.target.value || undefined })} />
      </label>
      <label>
        Raised to
        <input type="date" value={filters.raisedTo ?? ''} data-testid="filter-to" onChange={(e) => set({ raisedTo: e.target.value || undefined })} />
      </label>
    </form>
  );
}
