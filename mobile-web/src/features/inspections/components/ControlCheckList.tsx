import { CONTROLS, controlCriterion } from '@plummet/shared';
import { jurisdictionOf } from '../../../lib/jurisdiction';
import type { ControlCheckRecord, InspectionRecord } from '../../../local-db/records';
import { useLocalSite } from '../../sites/sites.queries';
import { useRecordControlCheckMutation } from '../inspections.mutations';
import { ControlCheckCard } from './ControlCheckCard';
import './ControlCheckList.css';

/** The falling-object controls of the walk, each answered on its own, with what passes under the site's jurisdiction. */
export function ControlCheckList({ inspection, checks }: { inspection: InspectionRecord; checks: readonly ControlCheckRecord[] }) {
  const record = useRecordControlCheckMutation();
  const finished = inspection.status === 'finished';
  const jurisdiction = jurisdictionOf(useLocalSite(inspection.siteId));
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
          criterion={controlCriterion(control, jurisdiction)}
          disabled={finished}
          onAnswer={({ result, note, photos }) =>
            record.mutate({ answer: { inspectionId: inspection.id, organisationId: inspection.organisationId, control, result, note }, photos })
          }
        />
      ))}
    </div>
  );
}
