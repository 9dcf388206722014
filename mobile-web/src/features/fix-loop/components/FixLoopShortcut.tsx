import { Icon } from '../../../components/ionic-elements';
import type { Role } from '@plummet/shared';
import { alarmOutline, checkmarkDoneOutline, constructOutline } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import { useFixList, useOrganisationSettings, useToVerify } from '../fix-loop.queries';
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

/** The way into the fix loop from the home: the fix list for a foreman, the to-verify list for everyone who verifies. */
export function FixLoopShortcut({ userId, role }: { userId: string; role: Role }) {
  const toVerify = useToVerify();
  if (role === 'foreman') {
    return (
      <Link to="/fix-list" className="fix-summary" data-testid="home-fix-list">
        <Icon icon={constructOutline} aria-hidden="true" />
        <strong>Fix list</strong>
        <OverdueFixes userId={userId} />
      </Link>
    );
  }
  if (role === 'admin') return null;
  return (
    <Link to="/to-verify" className="fix-summary" data-testid="home-to-verify" data-count={toVerify?.length ?? 0}>
      <Icon icon={checkmarkDoneOutline} aria-hidden="true" />
      <strong>To verify: {toVerify?.length ?? '…'}</strong>
      <span className="muted">fixed findings waiting for a second pair of eyes</span>
    </Link>
  );
}
