import { CONTROL_CRITERIA, INSPECTION_REASON_WORDS, outcomeWords } from '@plummet/shared';
import { CautionNote } from '../../../components/CautionNote';
import { formatDateTime } from '../../../lib/format-date';
import type { ScaffoldRecord } from '../../../local-db/records';
import { useLastSignedReport } from '../last-report.queries';

const RESULT_WORDS = { pass: 'in place', fail: 'failed', 'not-applicable': 'not applicable' } as const;

/** The last signed report of the scaffold, readable at the scaffold with no signal. */
export function LastReportSection({ scaffold }: { scaffold: ScaffoldRecord }) {
  const report = useLastSignedReport(scaffold);
  if (report === undefined) return null;
  return (
    <details className="scaffold-summary last-report" data-testid="last-report">
      <summary className="control-card__title">Last signed report</summary>
      {report === null ? (
        <p className="muted">No signed report of this scaffold is on this phone yet.</p>
      ) : (
        <LastReport report={report} />
      )}
    </details>
  );
}

function LastReport({ report }: { report: NonNullable<ReturnType<typeof useLastSignedReport>> }) {
  const outcome = outcomeWords(report);
  const lines: [string, string][] = [
    ['Signed', `${formatDateTime(report.finishedAt)} by ${[report.reporterName, report.reporterPosition].filter(Boolean).join(', ')}`],
    ['Reason', INSPECTION_REASON_WORDS[report.reason] ?? report.reason],
    ['Tag status recorded', outcome.status],
    ...(outcome.restriction !== null ? [['Restriction', outcome.restriction] as [string, string]] : []),
    ['Tags at the access points', outcome.tags],
    ['Report for', report.reportFor],
    ['Location', report.location],
    ['Scaffold inspected', report.equipment],
    ['Matters that could give rise to risk', report.mattersGivingRisk],
    ['Action taken', report.actionTaken],
    ['Further action needed', report.furtherAction],
  ];
  return (
    <>
      <dl className="data-list last-report__list">
        {lines.map(([label, value]) => (
          <div key={label}>
            <dt>{label}</dt>
            <dd className="last-report__value">{value || '—'}</dd>
          </div>
        ))}
      </dl>
      {report.controlChecks.length > 0 && (
        <ul className="last-report__checks">
          {report.controlChecks.map((check) => (
            <li key={check.id}>
              {CONTROL_CRITERIA[check.control] ? check.control.replace(/-/g, ' ') : check.control}: {RESULT_WORDS[check.result]}
              {check.note ? ` – ${check.note}` : ''}
            </li>
          ))}
        </ul>
      )}
      <CautionNote />
    </>
  );
}
