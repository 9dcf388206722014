import { IonButton } from '@ionic/react';
import type { SyncConflict, SyncConflictResolve, WindUnits } from '@plummet/shared';
import { useLiveQuery } from 'dexie-react-hooks';
import { type ReactNode, useState } from 'react';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format-date';
import { db } from '../../../local-db/db';
import type { Units } from '../../../lib/units';
import { CONTROL_WORDS } from '../../inspections/inspection-words';
import { canTypeValue, ENTITY_WORDS, fieldWords, parseTypedValue, replacedWords, valueWords, writerWords } from '../conflict-words';
import { describeResolveError, useResolveConflictMutation } from '../conflicts.mutations';

interface ConflictCardProps {
  conflict: SyncConflict;
  userId: string;
  units: Units;
  windUnits?: WindUnits;
}

/**
 * One conflict: the record (a finding, an inspection, a control check, the user's settings or a
 * scaffold's tag), the field, the value in place now and the value it replaced, with who wrote
 * each; settled by keeping one or typing another (on the server, so it needs a connection).
 */
export function ConflictCard(props: ConflictCardProps) {
  return props.conflict.entity === 'scaffold' ? <ScaffoldConflictCard {...props} /> : <RecordConflictCard {...props} />;
}

/** Where a third value is chosen after keeping one here. */
const THEN_EDIT: Record<SyncConflict['entity'], string> = {
  finding: 'in the finding',
  inspection: 'in the inspection',
  'control-check': 'in the inspection’s control check',
  scaffold: 'on the scaffold’s page',
  user: 'in Settings',
};

/** What a conflict is on, read from the phone's database: a link to it and where it is. */
interface ConflictSubject {
  title: ReactNode;
  where: string;
}

function useConflictSubject(conflict: SyncConflict): ConflictSubject | undefined {
  return useLiveQuery(async (): Promise<ConflictSubject> => {
    const kind = ENTITY_WORDS[conflict.entity];
    if (conflict.entity === 'user') return { title: <Link to="/settings">{kind}</Link>, where: 'changed on two of your phones' };
    if (conflict.entity === 'finding') {
      const record = await db.findings.get(conflict.entityId);
      if (!record) return { title: kind, where: 'a finding not on this phone' };
      const scaffold = await db.scaffolds.get(record.scaffoldId);
      return {
        title: (
          <Link to={`/findings/${record.id}`} data-testid="conflict-finding">
            {record.item.name}
          </Link>
        ),
        where: `${scaffold?.reference ?? 'Scaffold'} · ${record.elevation}, lift ${record.lift}, bay ${record.bay}`,
      };
    }
    const check = conflict.entity === 'control-check' ? await db.controlChecks.get(conflict.entityId) : undefined;
    const inspection = await db.inspections.get(check ? check.inspectionId : conflict.entityId);
    if (!inspection) return { title: kind, where: `${conflict.entity === 'control-check' ? 'a control check' : 'an inspection'} not on this phone` };
    const scaffold = await db.scaffolds.get(inspection.scaffoldId);
    return {
      title: <Link to={`/inspections/${inspection.id}`}>{check ? CONTROL_WORDS[check.control].label : kind}</Link>,
      where: `${check ? 'inspection of ' : ''}${scaffold?.reference ?? 'scaffold'}, started ${formatDateTime(inspection.startedAt)}`,
    };
  }, [conflict.entity, conflict.entityId]);
}

function RecordConflictCard({ conflict, userId, units, windUnits }: ConflictCardProps) {
  // Until the phone's database answers, name the kind of record only.
  const subject = useConflictSubject(conflict);
  const resolve = useResolveConflictMutation();
  const [typing, setTyping] = useState(false);
  const [text, setText] = useState(typeof conflict.currentValue === 'string' || typeof conflict.currentValue === 'number' ? String(conflict.currentValue) : '');
  const [problem, setProblem] = useState<string>();

  const winner = writerWords(conflict.winnerUserId, conflict.winnerName, userId);
  const settle = (body: SyncConflictResolve) => {
    setProblem(undefined);
    resolve.mutate({ id: conflict.id, body });
  };
  const settleTyped = () => {
    const parsed = parseTypedValue(conflict.field, text, units);
    if ('problem' in parsed) setProblem(parsed.problem);
    else settle({ keep: 'custom', value: parsed.value });
  };

  return (
    <article className="conflict-card" data-testid="conflict-card" data-conflict-id={conflict.id} data-field={conflict.field} data-entity={conflict.entity}>
      <h3 className="conflict-card__title">
        {subject?.title ?? ENTITY_WORDS[conflict.entity]}
        {subject && <span className="muted"> — {subject.where}</span>}
      </h3>
      <p>
        <strong data-testid="conflict-field">{fieldWords(conflict.field)}</strong> was changed on two phones before either had seen the other’s change.
      </p>
      <dl className="conflict-card__values">
        <dt>Now in place — written by {winner}, {formatDateTime(conflict.createdAt)}</dt>
        <dd data-testid="conflict-current">{valueWords(conflict.field, conflict.currentValue, units, windUnits)}</dd>
        <dt data-testid="conflict-replaced-by">Replaced — {replacedWords(conflict, userId)}</dt>
        <dd data-testid="conflict-replaced">{valueWords(conflict.field, conflict.replacedValue, units, windUnits)}</dd>
      </dl>
      <div className="conflict-card__actions">
        <IonButton disabled={resolve.isPending} onClick={() => settle({ keep: 'current' })} data-testid="keep-current">
          Keep the value in place
        </IonButton>
        <IonButton fill="outline" disabled={resolve.isPending} onClick={() => settle({ keep: 'replaced' })} data-testid="keep-replaced">
          Put the replaced value back
        </IonButton>
        {canTypeValue(conflict.field) && !typing && (
          <IonButton fill="clear" disabled={resolve.isPending} onClick={() => setTyping(true)} data-testid="type-another">
            Type another value
          </IonButton>
        )}
      </div>
      {typing && (
        <div className="conflict-card__typed">
          <label>
            {fieldWords(conflict.field)}
            {conflict.field === 'notes' ? (
              <textarea className="plain-textarea" value={text} onChange={(e) => setText(e.target.value)} data-testid="typed-value" />
            ) : (
              <input className="plain-textarea conflict-card__input" value={text} onChange={(e) => setText(e.target.value)} data-testid="typed-value" />
            )}
          </label>
          <IonButton disabled={resolve.isPending} onClick={settleTyped} data-testid="keep-typed">
            Keep this value
          </IonButton>
        </div>
      )}
      {!canTypeValue(conflict.field) && <p className="muted">To choose a third value, keep one here, then change it {THEN_EDIT[conflict.entity]}.</p>}
      {(problem || resolve.error) && (
        <p className="field-error" role="alert" data-testid="conflict-problem">
          {problem ?? describeResolveError(resolve.error)}
        </p>
      )}
    </article>
  );
}


/**
 * A clash on a scaffold's tag: the more restrictive tag is in place; settling keeps it or puts the
 * other back (a third tag is set on the scaffold's page afterwards).
 */
function ScaffoldConflictCard({ conflict, userId, units }: ConflictCardProps) {
  const scaffold = useLiveQuery(async () => (await db.scaffolds.get(conflict.entityId)) ?? null, [conflict.entityId]);
  const resolve = useResolveConflictMutation();
  const settle = (body: SyncConflictResolve) => resolve.mutate({ id: conflict.id, body });
  return (
    <article className="conflict-card" data-testid="conflict-card" data-conflict-id={conflict.id} data-field={conflict.field} data-entity="scaffold">
      <h3 className="conflict-card__title">
        {scaffold ? (
          <Link to={`/scaffolds/${scaffold.id}`} data-testid="conflict-scaffold">
            Scaffold {scaffold.reference}
          </Link>
        ) : (
          'Scaffold'
        )}
        <span className="muted"> — {scaffold === null ? 'a scaffold not on this phone' : 'its tag'}</span>
      </h3>
      <p>
        <strong data-testid="conflict-field">{fieldWords(conflict.field)}</strong> was set on two phones before either had seen the other’s change. The more
        restrictive tag stands until someone settles it.
      </p>
      <dl className="conflict-card__values">
        <dt>Now in place, the more restrictive — since {formatDateTime(conflict.createdAt)}</dt>
        <dd data-testid="conflict-current">{valueWords(conflict.field, conflict.currentValue, units)}</dd>
        <dt data-testid="conflict-replaced-by">Not in place — {replacedWords(conflict, userId)}</dt>
        <dd data-testid="conflict-replaced">{valueWords(conflict.field, conflict.replacedValue, units)}</dd>
      </dl>
      <div className="conflict-card__actions">
        <IonButton disabled={resolve.isPending} onClick={() => settle({ keep: 'current' })} data-testid="keep-current">
          Keep the tag in place
        </IonButton>
        <IonButton fill="outline" disabled={resolve.isPending} onClick={() => settle({ keep: 'replaced' })} data-testid="keep-replaced">
          Use the other tag
        </IonButton>
      </div>
      <p className="muted">To give a third tag, keep one here, then change the tag on the scaffold’s page.</p>
      {resolve.error && (
        <p className="field-error" role="alert" data-testid="conflict-problem">
          {describeResolveError(resolve.error)}
        </p>
      )}
    </article>
  );
}
