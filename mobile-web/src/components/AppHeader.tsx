import { IonBackButton, IonButtons, IonHeader, IonTitle, IonToolbar } from '@ionic/react';
import type { ReactNode } from 'react';
import { OnlineStatusBadge } from './OnlineStatusBadge';
import { SyncBadge } from './SyncBadge';

interface AppHeaderProps {
  title: string;
  /** Where the back arrow leads when there is no history (a page opened after a reload). */
  backHref?: string;
  /** Shown under the toolbar, e.g. the live estimate of the finding editor. */
  children?: ReactNode;
}

/** A page's toolbar with one compact connection and outbox status in it that opens the Sync status screen. */
export function AppHeader({ title, backHref, children }: AppHeaderProps) {
  return (
    <IonHeader>
      <IonToolbar>
        {backHref && (
          <IonButtons slot="start">
            <IonBackButton defaultHref={backHref} text="" aria-label="Back" />
          </IonButtons>
        )}
        <IonTitle>{title}</IonTitle>
        {/* One compact status at the toolbar's end: only what needs a look shows in words. */}
        <div slot="end" className="app-status">
          <OnlineStatusBadge />
          <SyncBadge />
        </div>
      </IonToolbar>
      {children}
    </IonHeader>
  );
}
