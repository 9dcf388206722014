import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { CautionNote } from '../../../components/CautionNote';
import { useUnits } from '../../auth/session.queries';
import { ManagerLayout } from '../components/ManagerLayout';
import { PhotoThumbnail } from '../components/PhotoThumbnail';
import { useAssignFindingsMutation, useReopenFindingMutation, useSettleConflictMutation } from '../manager.mutations';
import { useFinding, useFindingConflicts, useFindingHistory, useFindingPhotos, useMembers, useScaffolds } from '../manager.queries';
import { formatEnergy, formatHeight } from '../manager-units';
import { formatDateTime } from '../../../lib/format-date';

const when = formatDateTime;

/** One finding as a manager reviews it: where, what, the estimate, photos, history and what a manager may do. */
export function ManagerFindingPage() {
  const { findingId = '' } = useParams();
  const units = useUnits();
  const finding = useFinding(findingId);
  const history = useFindingHistory(findingId);
  const photos = useFindingPhotos(findingId);
  const conflicts = useFindingConflicts(findingId);
  const members = useMembers();
  const scaffolds = useScaffolds();
  const assign = useAssignFindingsMutation();
  const reopen = useReopenFindingMutation();
  const settle = useSettleConflictMutation();
  const [assignee, setAssignee] = useState('');
  const [due, setDue] = useState('');
  const [reopenNote, setReopenNote] = useState('');
  const f = finding.data;
  const nameOf = (id: string | null) => (id ? (members.data?.find((m) => m.id === id)?.name ?? 'Someone') : 'Nobody');
  const foremen = members.data?.filter((m) => m.role === 'foreman') ?? [];

  return (
    <ManagerLayout title="Finding" loadedAt={finding.dataUpdatedAt} refreshFailed={finding.isError} testId="manager-finding-page">
      <p>
        <Link to="/findings">Back to the findings</Link>
      </p>
      {!f && (finding.isError ? <p role="alert">The finding could not be loaded: {finding.error.message}</p> : <p>Loading the finding…</p>)}
      {f && (
        <>
          <section className="manager-section" aria-labelledby="finding-title">
            <h2 id="finding-title" data-testid="finding-title">{f.item.name}</h2>
            <dl className="manager-facts">
              <dt>Band and risk score</dt>
              <dd>{f.riskBand}, {f.riskScore} (severity {f.estimate.severity.label}, likelihood {f.estimate.likelihood.label})</dd>
              <dt>State</dt>
              <dd data-testid="finding-state">{f.state}{f.overdue ? ', overdue' : ''}</dd>
              <dt>Where</dt>
              <dd>{scaffolds.data?.find((s) => s.id === f.scaffoldId)?.reference ?? 'Scaffold'}: {f.elevation}, lift {f.lift}, bay {f.bay}, {formatHeight(f.heightM, units)} above the people below</dd>
              <dt>Assigned to</dt>
              <dd data-testid="finding-assignee">{nameOf(f.assigneeId)}{f.dueAt ? `, due ${when(f.dueAt)}` : ''}</dd>
              <dt>Note</dt>
              <dd>{f.notes || '—'}</dd>
              <dt>Raised</dt>
              <dd>{when(f.createdAt)} by {nameOf(f.createdBy)}</dd>
            </dl>
          </section>
          <section className="manager-section" aria-labelledby="finding-estimate">
            <h2 id="finding-estimate">Estimate</h2>
            <p>
              Impact energy {formatEnergy(f.estimate.impactEnergyJ, units)}, impact speed {f.estimate.impactVelocityMps.toFixed(1)} m/s, fall time{' '}
              {f.estimate.fallTimeS.toFixed(2)} s. {f.estimate.severity.basis}
            </p>
            <CautionNote />
          </section>
          <section className="manager-section" aria-labelledby="finding-photos">
            <h2 id="finding-photos">Photos</h2>
            {photos.data?.length ? (
              <div style={{ display: 'flex', gap: 8, flexWrap: 'wrap' }}>
                {photos.data.map((p, i) => <PhotoThumbnail key={p.id} photoId={p.id} alt={`Photo ${i + 1} of ${f.item.name}`} />)}
              </div>
            ) : (
              <p>No photo.</p>
            )}
          </section>
          <section className="manager-section" aria-labelledby="finding-actions">
            <h2 id="finding-actions">Actions</h2>
            <div className="manager-actions">
              <label>
                Foreman{' '}
                <select value={assignee} onChange={(e) => setAssignee(e.target.value)} data-testid="assign-foreman">
                  <option value="">Choose a foreman</option>
                  {foremen.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
                </select>
              </label>
              <label>
                Due by{' '}
                <input type="datetime-local" value={due} onChange={(e) => setDue(e.target.value)} />
              </label>
              <button type="button" disabled={!assignee || assign.isPending} data-testid="assign-button"
                onClick={() => assign.mutate({ ids: [f.id], assigneeId: assignee, dueAt: due ? new Date(due).toISOString() : f.dueAt })}>
                {f.assigneeId ? 'Reassign' : 'Assign'}
              </button>
              {assign.isSuccess && <span role="status">Assigned.</span>}
            </div>
            {(f.state === 'fixed' || f.state === 'verified') && (
              <div className="manager-actions">
                <label>
                  Reason to reopen{' '}
                  <input type="text" value={reopenNote} onChange={(e) => setReopenNote(e.target.value)} />
                </label>
                <button type="button" disabled={!reopenNote.trim() || reopen.isPending} onClick={() => reopen.mutate({ id: f.id, note: reopenNote.trim() })}>
                  Reopen
                </button>
              </div>
            )}
            {conflicts.data?.map((c) => (
              <div key={c.id} className="manager-actions" data-testid="conflict">
                <span>
                  Two edits of “{c.field}” met: kept {JSON.stringify(c.currentValue)}, replaced {JSON.stringify(c.replacedValue)}.
                </span>
                <button type="button" onClick={() => settle.mutate({ id: c.id, keep: 'current' })}>Keep the current value</button>
                <button type="button" className="manager-button--plain" onClick={() => settle.mutate({ id: c.id, keep: 'replaced' })}>
                  Put the replaced value back
                </button>
              </div>
            ))}
          </section>
          <section className="manager-section" aria-labelledby="finding-history">
            <h2 id="finding-history">History</h2>
            {history.data === null && <p>The history of changes, fixes and verifications shows here once the server records it.</p>}
            {history.data && (
              <ol data-testid="finding-history">
                {history.data.items.map((h, i) => (
                  <li key={i}>
                    {when(h.at)}: {h.kind === 'state' ? `${h.from ?? ''} → ${h.to ?? ''}` : h.kind}
                    {h.kind === 'assign' ? ` to ${nameOf(h.assigneeId)}` : ''} by {h.byName ?? nameOf(h.by)}
                    {h.note ? ` (${h.note})` : ''}
                  </li>
                ))}
              </ol>
            )}
          </section>
        </>
      )}
    </ManagerLayout>
  );
}
