import { IonButton } from '@ionic/react';
import { FINDING_CONTROLS, HAND_BACK_REASONS, isAlterationControl, type FindingControl, type HandBackReason } from '@plummet/shared';
import { useState } from 'react';
import { FormSection } from '../../../components/FormSection';
import { NumberField } from '../../../components/NumberField';
import { SelectField } from '../../../components/SelectField';
import { PhotoPicker } from '../../photos/components/PhotoPicker';
import type { PendingPhoto } from '../../photos/photos.store';
import { parseQuantity, unitLabel, type Units } from '../../../lib/units';
import { ALTERATION_WORDS, CONTROL_WORDS, HAND_BACK_WORDS } from '../fix-loop-words';

export type FixActionKind = 'made-safe' | 'fixed' | 'hand-back' | 'verify' | 'reopen';

export interface FixActionValues {
  kind: FixActionKind;
  note: string;
  control: FindingControl | null;
  zoneRadiusM?: number;
  reason?: HandBackReason;
  photos: PendingPhoto[];
}

const TITLES: Record<FixActionKind, string> = {
  'made-safe': 'Made safe for now',
  fixed: 'Fixed for good',
  'hand-back': 'Hand it back',
  verify: 'Verify the fix',
  reopen: 'Reopen: the fix does not hold',
};

const SUBMIT: Record<FixActionKind, string> = {
  'made-safe': 'Record made safe',
  fixed: 'Record the fix',
  'hand-back': 'Hand back',
  verify: 'Verify',
  reopen: 'Reopen',
};

const NOTE_LABELS: Record<FixActionKind, string> = {
  'made-safe': 'What was done for now',
  fixed: 'What was done',
  'hand-back': 'Anything the manager should know',
  verify: 'Note (optional)',
  reopen: 'Why it is reopened (the foreman reads this)',
};

interface FixActionFormProps {
  kind: FixActionKind;
  units: Units;
  /** A proof photo is required (a High finding, and the organisation asks for one). */
  photoRequired: boolean;
  busy: boolean;
  /** The refusal of the last attempt, in words. */
  refusal?: string;
  onSubmit(values: FixActionValues): void;
  onCancel(): void;
}

/** One action on a finding: a note, a control from the list, a proof photo, or a hand-back reason. */
export function FixActionForm({ kind, units, photoRequired, busy, refusal, onSubmit, onCancel }: FixActionFormProps) {
  const [note, setNote] = useState('');
  const [control, setControl] = useState<FindingControl | ''>('');
  const [radiusText, setRadiusText] = useState('');
  const [reason, setReason] = useState<HandBackReason | ''>('');
  const [photos, setPhotos] = useState<PendingPhoto[]>([]);
  // After a refused attempt the message follows the form: it changes or goes as the person mends it.
  const [tried, setTried] = useState(false);
  const takesControl = kind === 'made-safe' || kind === 'fixed';
  const takesPhoto = kind !== 'hand-back' && kind !== 'reopen';
  const controls = kind === 'made-safe' ? FINDING_CONTROLS.filter((c) => !isAlterationControl(c)) : FINDING_CONTROLS;

  const zoneRadiusM = control === 'close-zone' ? parseQuantity('distance', radiusText, units) : undefined;
  const missing =
    kind === 'hand-back' && !reason
      ? 'Choose why you hand it back.'
      : takesControl && !control
        ? 'Choose the control that was applied.'
        : (kind === 'made-safe' || kind === 'fixed' || kind === 'reopen') && !note.trim()
          ? kind === 'reopen'
            ? 'Say why it is reopened: the foreman will read it.'
            : 'Say what was done.'
          : control === 'close-zone' && !(zoneRadiusM && zoneRadiusM > 0)
            ? 'Give the radius of the closed zone.'
            : takesPhoto && photoRequired && photos.length === 0 && kind !== 'verify'
              ? 'Take a proof photo first: this is a High finding and your organisation asks for one.'
              : undefined;
  const problem = tried ? missing : undefined;

  function submit() {
    setTried(true);
    if (missing) return;
    onSubmit({ kind, note, control: control || null, zoneRadiusM, reason: reason || undefined, photos });
  }

  return (
    <FormSection title={TITLES[kind]}>
      <div data-testid="fix-action-form" data-kind={kind}>
        {kind === 'hand-back' && (
          <SelectField<string>
            label="Reason"
            value={reason}
            onChange={(value) => setReason(value as HandBackReason | '')}
            options={[{ value: '', label: 'Choose a reason' }, ...HAND_BACK_REASONS.map((r) => ({ value: r, label: HAND_BACK_WORDS[r] }))]}
            testId="hand-back-reason"
          />
        )}
        {takesControl && (
          <SelectField<string>
            label="Control applied"
            value={control}
            onChange={(value) => setControl(value as FindingControl | '')}
            options={[{ value: '', label: 'Choose a control' }, ...controls.map((c) => ({ value: c, label: CONTROL_WORDS[c] }))]}
            testId="fix-control"
          />
        )}
        {control === 'close-zone' && (
          <NumberField label="Radius of the closed zone" unit={unitLabel('distance', units)} value={radiusText} onChange={setRadiusText} testId="zone-radius" />
        )}
        {kind === 'fixed' && control && isAlterationControl(control) && (
          <p className="fix-notice" role="note" data-testid="alteration-notice">
            {ALTERATION_WORDS}
          </p>
        )}
        <label>
          <span className="select-field__label">{NOTE_LABELS[kind]}</span>
          <textarea className="plain-textarea" value={note} onChange={(event) => setNote(event.target.value)} data-testid="fix-note" />
        </label>
        {takesPhoto && (
          <>
            <PhotoPicker
              stored={[]}
              pending={photos}
              onAdd={(photo) => setPhotos((all) => [...all, photo])}
              onRemovePending={(id) => setPhotos((all) => all.filter((p) => p.id !== id))}
              label={kind === 'verify' ? 'Take a photo (optional)' : photoRequired ? 'Take the proof photo (required)' : 'Take a proof photo'}
              testId="fix-photos"
            />
            {photoRequired && kind !== 'verify' && <p className="field-helper">A High finding needs a proof photo from the camera: your organisation asks for one.</p>}
          </>
        )}
        {(problem ?? refusal) && (
          <p className={`fix-notice fix-notice--refusal`} role="alert" data-testid="fix-refusal">
            {problem ?? refusal}
          </p>
        )}
        <div className="bottom-actions">
          <IonButton fill="outline" onClick={onCancel}>
            Cancel
          </IonButton>
          <IonButton disabled={busy} onClick={submit} data-testid="fix-submit">
            {SUBMIT[kind]}
          </IonButton>
        </div>
      </div>
    </FormSection>
  );
}
