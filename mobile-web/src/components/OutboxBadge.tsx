import { Icon } from './ionic-elements';
import { checkmarkDoneOutline, cloudUploadOutline } from 'ionicons/icons';
import { useWaitingChangeCount } from '../local-db/outbox.queries';

/** How many changes on this phone wait to be sent; a word and an icon, never colour alone. */
export function OutboxBadge() {
  const count = useWaitingChangeCount();
  if (count === undefined) return null;
  const text = count === 0 ? 'All changes sent' : count === 1 ? '1 change waiting' : `${count} changes waiting`;
  return (
    <span className={`status-chip ${count > 0 ? 'status-chip--waiting' : ''}`} data-testid="outbox-count" data-count={count} role="status">
      <Icon icon={count > 0 ? cloudUploadOutline : checkmarkDoneOutline} aria-hidden="true" />
      {text}
    </span>
  );
}
