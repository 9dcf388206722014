import { Icon } from './ionic-elements';
import { cloudDoneOutline, cloudOfflineOutline } from 'ionicons/icons';
import { useOnlineStatus } from '../lib/use-online-status';
import './OnlineStatusBadge.css';

/** "Online" / "Offline" with an icon and a word, never colour alone. */
export function OnlineStatusBadge() {
  const online = useOnlineStatus();
  return (
    <span
      className={`online-status ${online ? 'online-status--online' : 'online-status--offline'}`}
      data-testid="online-status"
      data-online={online}
      role="status"
    >
      <Icon icon={online ? cloudDoneOutline : cloudOfflineOutline} aria-hidden="true" />
      {online ? 'Online' : 'Offline'}
    </span>
  );
}
