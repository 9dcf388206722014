import { SCAFFOLD_STATUS_WORDS, type ScaffoldStatus } from '@plummet/shared';
import './ScaffoldStatusTag.css';

/**
 * The scaffold's tag status as the last inspection recorded it: a shape and words as well as a
 * colour (a ring for cleared, a half-filled diamond for limited, a solid bar for closed), so it
 * reads without colour vision and never as a tick/warning/cross.
 */
export function ScaffoldStatusTag({ status, recorded }: { status: ScaffoldStatus; recorded?: string | null }) {
  return (
    <span className={`scaffold-status scaffold-status--${status}`} data-testid="scaffold-status" data-status={status}>
      <span className="scaffold-status__shape" aria-hidden="true" />
      <span>{SCAFFOLD_STATUS_WORDS[status]}</span>
      {recorded !== undefined && <span className="scaffold-status__recorded">{recorded ?? 'not inspected yet'}</span>}
    </span>
  );
}
