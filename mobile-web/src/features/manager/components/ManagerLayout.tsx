import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar, IonButtons } from '@ionic/react';
import { type ReactNode, useEffect, useRef } from 'react';
import { NavLink } from 'react-router-dom';
import { OnlineStatusBadge } from '../../../components/OnlineStatusBadge';
import { useOnlineStatus } from '../../../lib/use-online-status';
import { useSession } from '../../auth/session.queries';
import './ManagerLayout.css';
import { formatDateTime } from '../../../lib/format-date';

/** Sections of the managers' frame; the setting-up ones and the unsent e-mails only for admins. */
const SECTIONS: readonly { to: string; label: string; adminOnly?: boolean }[] = [
  { to: '/overview', label: 'Overview' },
  { to: '/findings', label: 'Findings' },
  { to: '/trends', label: 'Trends' },
  { to: '/reports', label: 'Reports' },
  { to: '/setup/sites', label: 'Sites and scaffolds' },
  { to: '/setup/people', label: 'People', adminOnly: true },
  { to: '/setup/organisation', label: 'Organisation', adminOnly: true },
  { to: '/setup/catalogue', label: 'Item catalogue', adminOnly: true },
  { to: '/calculator', label: 'Quick estimate' },
  { to: '/settings', label: 'Settings' },
  { to: '/mail/failed', label: 'E-mails not sent', adminOnly: true },
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
  const isAdmin = role === 'admin';
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
              {SECTIONS.filter((s) => isAdmin || !s.adminOnly).map((s) => (
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
                Showing what was loaded at {formatDateTime(new Date(loadedAt).toISOString())}; it may be out of date until the connection returns.
              </p>
            )}
            {children}
          </main>
        </div>
      </IonContent>
    </IonPage>
  );
}
