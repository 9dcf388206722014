import { CONTROL_RESULTS, type Control, type ControlCriterion, type ControlResult } from '@plummet/shared';
import { useState } from 'react';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import type { ControlCheckRecord } from '../../../local-db/records';
import { PhotoPicker } from '../../photos/components/PhotoPicker';
import { usePhotos } from '../../photos/photos.queries';
import type { PendingPhoto } from '../../photos/photos.store';
import { CONTROL_WORDS, RESULT_WORDS } from '../inspection-words';


interface ControlCheckCardProps {
  control: Control;
  check?: ControlCheckRecord;
  /** What passes under the site's jurisdiction, with its source. */
  criterion: ControlCriterion;
  disabled: boolean;
  onAnswer(answer: { result: ControlResult; note: string; photos?: PendingPhoto[] }): void;
}

/** One control: pass / fail / not applicable, a note, and a photo when it fails. Saved as it changes. */
export function ControlCheckCard({ control, check, criterion, disabled, onAnswer }: ControlCheckCardProps) {
  const [note, setNote] = useState(check?.note ?? '');
  const photos = usePhotos('control-check', check?.id);
  const words = CONTROL_WORDS[control];
  const result = check?.result;

  return (
    <section className={`control-card ${result ? `control-card--${result}` : ''}`} data-testid={`control-${control}`} data-result={result ?? ''}>
      <h3 className="control-card__title">{words.label}</h3>
      <p className="control-card__hint">{words.lookFor}</p>
      <p className="control-card__criterion" data-testid={`control-${control}-criterion`}>
        <strong>Passes when:</strong> {criterion.criterion} <span className="control-card__source">({criterion.source})</span>
      </p>
      <ChoiceGroup
        legend={`${words.label}: result`}
        value={result}
        choices={CONTROL_RESULTS.map((value) => ({ value, label: RESULT_WORDS[value] }))}
        onChange={(value) => onAnswer({ result: value, note })}
        testId={`control-${control}-result`}
        disabled={disabled}
        legendHidden
      />
      <label className="control-card__note">
        <span className="select-field__label">Note{result === 'fail' ? ' (what failed, where)' : ''}</span>
        <textarea
          className="plain-textarea"
          rows={2}
          value={note}
          disabled={disabled}
          onChange={(event) => setNote(event.target.value)}
          onBlur={() => result && note !== (check?.note ?? '') && onAnswer({ result, note })}
          data-testid={`control-${control}-note`}
        />
      </label>
      {result === 'fail' && (
        <PhotoPicker
          stored={photos ?? []}
          pending={[]}
          onAdd={(photo) => onAnswer({ result, note, photos: [photo] })}
          onRemovePending={() => undefined}
          label="Add a photo of the failure"
          testId={`control-${control}-photo`}
        />
      )}
    </section>
  );
}
