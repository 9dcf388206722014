import { IonButton, IonNote } from '@ionic/react';
import { SCAFFOLD_TRIGGER_WORDS, type ScaffoldTriggerKind, TRIGGER_REGULATION } from '@plummet/shared';
import { useState } from 'react';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import type { ScaffoldRecord } from '../../../local-db/records';
import { useOnlineStatus } from '../../../lib/use-online-status';
import { useRecordTriggerMutation } from '../register.mutations';

const KIND_HINTS: Record<ScaffoldTriggerKind, string> = {
  altered: 'Something was added, removed or moved',
  'adverse-weather': 'High wind, storm, heavy snow or ice',
};

/**
 * "Altered" or "adverse weather" recorded from the scaffold: it is closed to use and its inspection
 * is due now (UK WAHR 2005 reg. 12(4)(b)). Online only: the tag changes for everyone at once.
 */
export function TriggerCard({ scaffold }: { scaffold: ScaffoldRecord }) {
  const online = useOnlineStatus();
  const record = useRecordTriggerMutation();
  const [open, setOpen] = useState(false);
  const [kind, setKind] = useState<ScaffoldTriggerKind>();
  const [note, setNote] = useState('');
  const ready = kind !== undefined && note.trim() !== '';

  if (!open) {
    return (
      <div className="trigger-card" data-testid="trigger-card">
        <IonButton fill="outline" onClick={() => setOpen(true)} data-testid="open-trigger">
          Altered or adverse weather…
        </IonButton>
        {record.isSuccess && (
          <p className="muted" role="status" data-testid="trigger-recorded">
            Recorded: the scaffold is closed to use and its inspection is due now.
          </p>
        )}
      </div>
    );
  }
  return (
    <section className="trigger-card scaffold-summary" data-testid="trigger-card" aria-labelledby="trigger-heading">
      <h2 id="trigger-heading" className="control-card__title">
        Close it until inspected
      </h2>
      <p className="muted">
        After an alteration or adverse weather the scaffold must be inspected before use ({TRIGGER_REGULATION.uk}; {TRIGGER_REGULATION.us}). Recording it
        closes the scaffold to use and puts its inspection on everyone&rsquo;s due list now.
      </p>
      <ChoiceGroup<ScaffoldTriggerKind>
        legend="What happened"
        value={kind}
        choices={(['altered', 'adverse-weather'] as const).map((value) => ({ value, label: SCAFFOLD_TRIGGER_WORDS[value], hint: KIND_HINTS[value] }))}
        onChange={setKind}
        layout="stack"
        testId="trigger-kind"
      />
      <label className="control-card__note">
        <span className="select-field__label">What, where (required)</span>
        <textarea className="plain-textarea" rows={2} value={note} onChange={(e) => setNote(e.target.value)} data-testid="trigger-note" />
      </label>
      {!online && (
        <IonNote color="danger" role="alert" data-testid="trigger-offline">
          No connection: this cannot be recorded from the phone now. Close the scaffold at its access points, and tell the site manager or record it when back
          in signal.
        </IonNote>
      )}
      <div className="bottom-actions">
        <IonButton fill="clear" onClick={() => setOpen(false)}>
          Cancel
        </IonButton>
        <IonButton
          disabled={!online || !ready || record.isPending}
          onClick={() =>
            kind && record.mutate({ scaffold, body: { kind, note: note.trim() } }, { onSuccess: () => (setOpen(false), setNote(''), setKind(undefined)) })
          }
          data-testid="record-trigger"
        >
          Close to use and make due
        </IonButton>
      </div>
    </section>
  );
}
