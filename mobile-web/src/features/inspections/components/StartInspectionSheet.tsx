import { IonButton } from '@ionic/react';
import { INSPECTION_REASONS, LIMITS, type InspectionReason } from '@plummet/shared';
import { useState } from 'react';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { NumberField } from '../../../components/NumberField';
import { Sheet } from '../../../components/Sheet';
import { formatWind, parseWind, windUnitLabel, type WindUnits } from '../../../lib/units';
import { REASON_WORDS } from '../inspection-words';

interface StartInspectionSheetProps {
  isOpen: boolean;
  scaffoldReference: string;
  /** The user's own unit for wind (kept apart from the display units). */
  windUnits: WindUnits;
  onCancel(): void;
  onStart(start: { reason: InspectionReason; windSpeedMps: number | null }): void;
}

/** Why this walk, and the wind now (for the drift of every finding). */
export function StartInspectionSheet({ isOpen, scaffoldReference, windUnits, onCancel, onStart }: StartInspectionSheetProps) {
  const [reason, setReason] = useState<InspectionReason>('scheduled');
  const [windText, setWindText] = useState('');
  const wind = windText.trim() === '' ? null : parseWind(windText, windUnits);
  const windError =
    wind === undefined ? 'Enter a number, or leave it empty.' : wind !== null && (wind < 0 || wind > LIMITS.windMaxMps) ? `Between 0 and ${formatWind(LIMITS.windMaxMps, windUnits)}.` : undefined;

  return (
    <Sheet
      open={isOpen}
      title={`Start inspecting ${scaffoldReference}`}
      onClose={onCancel}
      testId="start-inspection-sheet"
      footer={
        <>
          <IonButton fill="outline" onClick={onCancel}>
            Cancel
          </IonButton>
          <IonButton disabled={!!windError} onClick={() => onStart({ reason, windSpeedMps: wind ?? null })} data-testid="start-walk">
            Start the walk
          </IonButton>
        </>
      }
    >
        <ChoiceGroup<InspectionReason>
          legend="Why inspect now?"
          layout="stack"
          value={reason}
          onChange={setReason}
          choices={INSPECTION_REASONS.map((value) => ({ value, ...REASON_WORDS[value] }))}
          testId="inspection-reason"
        />
        <NumberField
          label="Wind speed now"
          unit={windUnitLabel(windUnits)}
          value={windText}
          onChange={setWindText}
          error={windError}
          helper="Used for how far items drift as they fall. Leave empty if not measured."
          testId="inspection-wind"
        />
    </Sheet>
  );
}
