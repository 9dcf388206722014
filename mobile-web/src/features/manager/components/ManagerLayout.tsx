import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar, IonButtons } from '@ionic/react';
import type { Role } from '@plummet/shared';
import { type ReactNode, useEffect, useRef } from 'react';
import { NavLink } from 'react-router-dom';
import { OnlineStatusBadge } from '../../../components/OnlineStatusBadge';
import { useOnlineStatus } from '../../../lib/use-online-status';
import { useSession } from '../../auth/session.queries';
import './ManagerLayout.css';

const SECTIONS: { to: string; label: string; only?: Role }[] = [
  { to: '/overview', label: 'Overview' },
  { to: '/findings', label: 'Findings' },
  { to: '/trends', label: 'Trends' },
  { to: '/reports', label: 'Reports' },
  { to: '/calculator', label: 'Quick estimate' },
  { to: '/settings', label: 'Settings' },
  { to: '/mail/failed', label: 'E-mails not sent', only: 'admin' },
];

interface Props {
  title: string;
  children: ReactNode;
  /** When the figures shown were loaded (ms), to say how old they are when they may be stale. */
  loadedAt?: number;
  /** The last refresh failed (offline or an error) while older figures are shown. */
  refreshFailed?: boolean;
  testId?: string;
}

/** The managers' frame: a side menu beside the page on a desk, a row of sections above it on a phone. */
export function ManagerLayout({ title, children, loadedAt, refreshFailed, testId }: Props) {
  const online = useOnlineStatus();
  const role = useSession().session?.user.role;
  const nav = useRef<HTMLElement>(null);
  // On a phone the sections scroll sideways: keep the current one in view.
  useEffect(() => {
    nav.current?.querySelector('a.is-active')?.scrollIntoView({ block: 'nearest', inline: 'nearest' });
  }, [role]);
  const stale = loadedAt !== undefined && loadedAt > 0 && (!online || refreshFailed);
  return (
    <IonPage data-testid={testId}>
      <IonHeader>
        <IonToolbar>
          <IonTitle>{title}</IonTitle>
          <IonButtons slot="end">
            <OnlineStatusBadge />
          </IonButtons>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="manager-layout">
          <nav ref={nav} className="manager-layout__nav" aria-label="Manager sections">
            <span className="manager-layout__brand" aria-hidden="true">Plummet</span>
            <ul>
              {SECTIONS.filter((s) => !s.only || s.only === role).map((s) => (
                <li key={s.to}>
                  <NavLink to={s.to} className={({ isActive }) => (isActive ? 'is-active' : undefined)}>
                    {s.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <main className="manager-layout__main">
            {stale && (
              <p className="manager-layout__stale" role="status" data-testid="stale-note">
                Showing what was loaded at {new Date(loadedAt).toLocaleString()}; it may be out of date until the connection returns.
              </p>
            )}
            {children}
          </main>
        </div>
      </IonContent>
    </IonPage>
  );
}
