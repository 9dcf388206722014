import { CONTROLS } from '@plummet/shared';
import type { ControlCheckRecord, InspectionRecord } from '../../../local-db/records';
import { useRecordControlCheckMutation } from '../inspections.mutations';
import { ControlCheckCard } from './ControlCheckCard';
import './ControlCheckList.css';

/** The seven falling-object controls of the walk, each answered on its own. */
export function ControlCheckList({ inspection, checks }: { inspection: InspectionRecord; checks: readonly ControlCheckRecord[] }) {
  const record = useRecordControlCheckMutation();
  const finished = inspection.status === 'finished';
  return (
    <div className="control-list" data-testid="control-list">
      <p className="muted">
        {checks.length} of {CONTROLS.length} answered. Each answer is saved on this phone as you go.
      </p>
      {CONTROLS.map((control) => (
        <ControlCheckCard
          key={control}
          control={control}
          check={checks.find((check) => check.control === control)}
          disabled={finished}
          onAnswer={({ result, note, photos }) =>
            record.mutate({ answer: { inspectionId: inspection.id, organisationId: inspection.organisationId, control, result, note }, photos })
          }
        />
      ))}
    </div>
  );
}
