import { alarmOutline } from 'ionicons/icons';
import { Icon } from '../../../components/ionic-elements';
import { useFixList } from '../fix-loop.queries';
import { useOrganisationSettings } from '../organisation-settings.queries';
import '../fix-loop.css';

/** A foreman's overdue fixes, in words (the home and the sync screen show it). */
export function OverdueFixes({ userId }: { userId: string }) {
  const settings = useOrganisationSettings();
  const entries = useFixList(userId, settings);
  if (!entries) return null;
  const overdue = entries.filter((e) => e.due.overdue).length;
  return (
    <p className={overdue ? 'fix-summary__overdue' : 'muted'} data-testid="overdue-fixes" data-count={overdue}>
      {overdue ? <Icon icon={alarmOutline} aria-hidden="true" /> : null} {overdue === 0 ? 'No fix overdue.' : `${overdue} ${overdue === 1 ? 'fix' : 'fixes'} overdue.`} {entries.length} on the fix list.
    </p>
  );
}
