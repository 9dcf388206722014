import { IonNote } from '@ionic/react';
import { type OutcomePrompt, SCAFFOLD_STATUSES, SCAFFOLD_STATUS_WORDS, type ScaffoldStatus } from '@plummet/shared';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { FormSection } from '../../../components/FormSection';

export interface OutcomeFields {
  tagStatus: ScaffoldStatus | null;
  restriction: string;
  accessTagsChanged: boolean | null;
}

const STATUS_HINTS: Record<ScaffoldStatus, string> = {
  cleared: 'The scaffold may be used as designed',
  limited: 'Only part of it, or a lighter load: say which below',
  closed: 'Nobody uses it until it is put right and inspected',
};

interface OutcomeSectionProps {
  value: OutcomeFields;
  onChange(value: OutcomeFields): void;
  issues: Partial<Record<string, string>>;
  prompts: readonly OutcomePrompt[];
  disabled: boolean;
}

/** The finish step's outcome: the tag status given, the restriction when limited, and the tags at the access points. */
export function OutcomeSection({ value, onChange, issues, prompts, disabled }: OutcomeSectionProps) {
  return (
    <FormSection title="What you record on the tag" testId="outcome-section">
      <ChoiceGroup
        legend="Tag status you give the scaffold"
        value={value.tagStatus ?? undefined}
        choices={SCAFFOLD_STATUSES.map((status) => ({ value: status, label: SCAFFOLD_STATUS_WORDS[status], hint: STATUS_HINTS[status] }))}
        onChange={(tagStatus) => onChange({ ...value, tagStatus })}
        layout="stack"
        testId="outcome-status"
        disabled={disabled}
      />
      {issues.tagStatus && <IonNote color="danger" className="field-error">{issues.tagStatus}</IonNote>}
      {value.tagStatus === 'limited' && (
        <label className="report-field">
          <span className="select-field__label">The limit: which lifts and bays, what load (required)</span>
          <textarea
            className="plain-textarea"
            rows={3}
            value={value.restriction}
            disabled={disabled}
            onChange={(event) => onChange({ ...value, restriction: event.target.value })}
            data-testid="outcome-restriction"
          />
          {issues.restriction && <IonNote color="danger" className="field-error">{issues.restriction}</IonNote>}
        </label>
      )}
      <ChoiceGroup
        legend="Tags at every access point changed to match"
        value={value.accessTagsChanged === null ? undefined : value.accessTagsChanged ? 'yes' : 'no'}
        choices={[
          { value: 'yes', label: 'Yes, every one' },
          { value: 'no', label: 'Not yet' },
        ]}
        onChange={(answer) => onChange({ ...value, accessTagsChanged: answer === 'yes' })}
        testId="outcome-tags"
        disabled={disabled}
      />
      {issues.accessTagsChanged && <IonNote color="danger" className="field-error">{issues.accessTagsChanged}</IonNote>}
      {prompts.map((prompt) => (
        <p key={prompt.code} className="empty-note" role="alert" data-testid={`outcome-prompt-${prompt.code}`}>
          {prompt.message}
        </p>
      ))}
    </FormSection>
  );
}
