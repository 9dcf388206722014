import { useQuery } from '@tanstack/react-query';
import { fetchDueList } from '../register.api';
import { registerKeys } from '../register.queries';
import { DueList } from './DueList';

/** The managers' list of inspections due (every site, or the one chosen), each linking to its reports. */
export function ManagerDueSection({ siteId }: { siteId?: string }) {
  const due = useQuery({ queryKey: registerKeys.due(siteId), queryFn: () => fetchDueList(siteId), refetchInterval: 60_000 });
  return (
    <section className="manager-section" aria-labelledby="overview-due" data-testid="overview-due">
      <h2 id="overview-due">Inspections due</h2>
      {due.isError && <p role="alert">The list of inspections due could not be loaded: {due.error.message}</p>}
      {!due.data && !due.isError && <p>Loading…</p>}
      {due.data && <DueList items={due.data.items} linkTo={(item) => `/reports?${new URLSearchParams({ siteId: item.siteId, scaffoldId: item.scaffoldId }).toString()}`} />}
    </section>
  );
}
