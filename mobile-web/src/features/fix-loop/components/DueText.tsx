import { IonIcon } from '@ionic/react';
import type { DueWords } from '@plummet/shared';
import { alarmOutline, timeOutline } from 'ionicons/icons';

/** The due time in words ("overdue by 2 days"), red and with an alarm when late: never colour alone. */
export function DueText({ due }: { due: DueWords }) {
  return (
    <span className={due.overdue ? 'due-text due-text--overdue' : 'due-text'} data-testid="due-text" data-overdue={due.overdue}>
      <IonIcon icon={due.overdue ? alarmOutline : timeOutline} aria-hidden="true" />
      {due.overdue ? due.words.replace(/^overdue/, 'Overdue') : due.words.replace(/^due/, 'Due')}
    </span>
  );
}
