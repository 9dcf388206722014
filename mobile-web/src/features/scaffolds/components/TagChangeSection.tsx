import { IonButton } from '@ionic/react';
import { LIMITS, SCAFFOLD_STATUSES, SCAFFOLD_STATUS_WORDS, type ScaffoldStatus } from '@plummet/shared';
import { useState } from 'react';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { FormSection } from '../../../components/FormSection';
import type { ScaffoldRecord } from '../../../local-db/records';
import { useChangeScaffoldStatusMutation } from '../scaffolds.mutations';

/**
 * Changing the tag on site between inspections (storm damage, ties removed), with the reason. Saved
 * on the phone and sent at the next sync, so it works with no signal. When another tag was set
 * meanwhile that this phone had not seen, the more restrictive one stands and a conflict waits on
 * the sync screen.
 */
export function TagChangeSection({ scaffold }: { scaffold: ScaffoldRecord }) {
  const change = useChangeScaffoldStatusMutation();
  const [open, setOpen] = useState(false);
  const [status, setStatus] = useState<ScaffoldStatus>(scaffold.status);
  const [note, setNote] = useState('');

  if (!open) {
    return (
      <IonButton fill="outline" expand="block" onClick={() => setOpen(true)} data-testid="change-tag">
        Change the tag
      </IonButton>
    );
  }
  const record = () =>
    change.mutate(
      { scaffoldId: scaffold.id, change: { status, note: note.trim() } },
      {
        onSuccess: () => {
          setOpen(false);
          setNote('');
        },
      },
    );
  return (
    <FormSection title="Change the tag" testId="tag-change">
      <ChoiceGroup
        legend="Tag status you give the scaffold"
        value={status}
        choices={SCAFFOLD_STATUSES.map((value) => ({ value, label: SCAFFOLD_STATUS_WORDS[value] as string }))}
        onChange={(value) => setStatus(value)}
        layout="stack"
        testId="tag-change-status"
        disabled={change.isPending}
      />
      <label className="report-field">
        <span className="select-field__label">Why (e.g. ties removed on lift 3)</span>
        <textarea className="plain-textarea" rows={2} maxLength={LIMITS.noteMax} value={note} onChange={(e) => setNote(e.target.value)} data-testid="tag-change-note" />
      </label>
      <div className="bottom-actions">
        <IonButton fill="clear" disabled={change.isPending} onClick={() => setOpen(false)}>
          Cancel
        </IonButton>
        <IonButton disabled={change.isPending} onClick={record} data-testid="tag-change-save">
          Record this tag
        </IonButton>
      </div>
    </FormSection>
  );
}
