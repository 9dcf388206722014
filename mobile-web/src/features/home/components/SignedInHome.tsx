import { ShowWhenSettled } from '../../../components/ShowWhenSettled';
import type { StoredSession } from '../../auth/session';
import { FixLoopShortcut } from '../../fix-loop/components/FixLoopShortcut';
import { DueSection } from '../../register/components/DueSection';
import { SitesOverview } from '../../sites/components/SitesOverview';

/**
 * The signed-in home's body: the way into the fix loop, the due list and the sites. Loaded apart
 * from the header (HomeScreen.tsx) and preloaded with it, so that its code, with the schemas it
 * checks the server's answers with, runs in a task of its own after the session has been read.
 */
export function SignedInHome({ session, expired }: { session: StoredSession; expired: boolean }) {
  return (
    <ShowWhenSettled parts={['due', 'sites']}>
      <FixLoopShortcut userId={session.user.id} role={session.user.role} />
      <DueSection />
      <SitesOverview session={session} expired={expired} />
    </ShowWhenSettled>
  );
}
