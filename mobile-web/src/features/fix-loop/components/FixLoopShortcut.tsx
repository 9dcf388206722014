import { Icon } from '../../../components/ionic-elements';
import type { Role } from '@plummet/shared';
import { checkmarkDoneOutline, constructOutline } from 'ionicons/icons';
import { lazy, Suspense } from 'react';
import { Link } from 'react-router-dom';
import { useToVerify } from '../fix-loop.queries';
import '../fix-loop.css';

/** A foreman's overdue fixes: on demand, since reading the organisation's settings builds their schema. */
const OverdueFixes = lazy(() => import('./OverdueFixes').then((module) => ({ default: module.OverdueFixes })));

/** The way into the fix loop from the home: the fix list for a foreman, the to-verify list for everyone who verifies. */
export function FixLoopShortcut({ userId, role }: { userId: string; role: Role }) {
  const toVerify = useToVerify();
  if (role === 'foreman') {
    return (
      <Link to="/fix-list" className="fix-summary" data-testid="home-fix-list">
        <Icon icon={constructOutline} aria-hidden="true" />
        <strong>Fix list</strong>
        <Suspense fallback={null}>
          <OverdueFixes userId={userId} />
        </Suspense>
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
