import { Icon } from './ionic-elements';
import { CAUTION_TEXT } from '@plummet/shared';
import { warningOutline } from 'ionicons/icons';

/** The safety caution every estimate screen carries (BRIEF, "Safety stance"). */
export function CautionNote() {
  return (
    <aside className="plummet-caution" aria-label="Caution">
      <Icon icon={warningOutline} aria-hidden="true" />
      <p data-testid="caution" style={{ margin: 0 }}>
        {CAUTION_TEXT}
      </p>
    </aside>
  );
}
