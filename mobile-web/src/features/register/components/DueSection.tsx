import { useReportSettled } from '../../../components/ShowWhenSettled';
import { useDueList } from '../register.queries';
import { DueList } from './DueList';

/** The inspector's due list on the home screen: from the server online, from this phone offline. */
export function DueSection() {
  const { items, fromServer, failed, settled } = useDueList();
  useReportSettled('due', settled && items !== undefined);
  return (
    <section className="due-section page-body" aria-labelledby="due-heading" data-testid="due-section">
      <h2 id="due-heading" className="page-heading">
        Inspections due
      </h2>
      {!fromServer && <p className="muted">{failed ? 'The list could not be loaded: showing' : 'Offline: showing'} the scaffolds kept on this phone.</p>}
      {items === undefined ? <p className="muted">Loading…</p> : <DueList items={items} linkTo={(item) => `/scaffolds/${item.scaffoldId}`} />}
    </section>
  );
}
