import { DUE_STATE_WORDS, REGIME_WORDS, type RegisterDueItem, SCAFFOLD_TRIGGER_WORDS } from '@plummet/shared';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format-date';
import { ScaffoldStatusTag } from '../../scaffolds/components/ScaffoldStatusTag';
import './DueList.css';

/** Why it is on the list, in a line: the trigger with its regulation, or the due time under the regime. */
function dueLine(item: RegisterDueItem): string {
  if (item.trigger) return `${SCAFFOLD_TRIGGER_WORDS[item.trigger.kind]} ${formatDateTime(item.trigger.recordedAt)}: ${item.trigger.note} (${item.trigger.regulation})`;
  if (item.state === 'first-inspection') return 'Not inspected yet: handover inspection before first use';
  return `Due ${formatDateTime(item.nextDueAt)}`;
}

/** Inspections due: each scaffold with its tag status, why it is due, and its regime with the regulation. */
export function DueList({ items, linkTo }: { items: readonly RegisterDueItem[]; linkTo: (item: RegisterDueItem) => string }) {
  if (items.length === 0) return <p className="muted" data-testid="due-list-empty">No inspection is due today or overdue.</p>;
  return (
    <ul className="due-list" data-testid="due-list">
      {items.map((item) => (
        <li key={item.scaffoldId} className={`due-item due-item--${item.state}`} data-testid="due-item" data-scaffold-id={item.scaffoldId} data-state={item.state}>
          <Link to={linkTo(item)} className="due-item__link">
            <span className="due-item__head">
              <span className="due-item__state">{DUE_STATE_WORDS[item.state]}</span>
              <span className="due-item__ref">
                {item.siteName} · scaffold {item.reference}
              </span>
            </span>
            <ScaffoldStatusTag status={item.status} />
            <span className="due-item__line">{dueLine(item)}</span>
            <span className="due-item__regime" data-testid="due-item-regime">
              {REGIME_WORDS[item.regime]} ({item.regulation})
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
