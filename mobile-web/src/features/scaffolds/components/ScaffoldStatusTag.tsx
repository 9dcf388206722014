import { IonIcon } from '@ionic/react';
import type { ScaffoldStatus } from '@plummet/shared';
import './ScaffoldStatusTag.css';
import { alertCircle, checkmarkCircle, closeCircle } from 'ionicons/icons';

const LOOK: Record<ScaffoldStatus, { icon: string; modifier: string }> = {
  'Safe to use': { icon: checkmarkCircle, modifier: 'ok' },
  'Restricted use': { icon: alertCircle, modifier: 'restricted' },
  'Do not use': { icon: closeCircle, modifier: 'closed' },
};

/** The scaffold's tag status (trade practice), as an icon and its words. */
export function ScaffoldStatusTag({ status }: { status: ScaffoldStatus }) {
  const look = LOOK[status];
  return (
    <span className={`scaffold-status scaffold-status--${look.modifier}`} data-testid="scaffold-status">
      <IonIcon icon={look.icon} aria-hidden="true" />
      {status}
    </span>
  );
}
