import { IonButton, IonContent, IonFooter, IonInput, IonNote, IonPage, useIonRouter } from '@ionic/react';
import { InspectionFinishSchema, outcomePrompts } from '@plummet/shared';
import { useEffect, useState } from 'react';
import { useParams } from 'react-router-dom';
import { AppHeader } from '../../../components/AppHeader';
import { CautionNote } from '../../../components/CautionNote';
import { FormSection } from '../../../components/FormSection';
import { db, readMeta, writeMeta } from '../../../local-db/db';
import { RequireSession } from '../../auth/components/RequireSession';
import { useSession, useUnits } from '../../auth/session.queries';
import { useFindingsOfInspection, useFindingsOfScaffold } from '../../findings/findings.queries';
import { useScaffold } from '../../scaffolds/scaffolds.queries';
import { useLocalSite } from '../../sites/sites.queries';
import { type OutcomeFields, OutcomeSection } from '../components/OutcomeSection';
import { SignaturePad } from '../components/SignaturePad';
import { CONTROL_WORDS } from '../inspection-words';
import { useControlChecks, useInspection } from '../inspections.queries';
import { useFinishInspectionMutation } from '../inspections.mutations';
import { unansweredControls } from '../inspections.store';
import { draftReport, REPORT_FIELD_LABELS, type ReportFields } from '../report-draft';

const draftKey = (inspectionId: string) => `report-draft:${inspectionId}`;
const LONG_FIELDS = ['location', 'equipment', 'mattersGivingRisk', 'actionTaken', 'furtherAction'] as const;

export function InspectionFinishPage() {
  const { inspectionId } = useParams();
  const router = useIonRouter();
  const units = useUnits();
  const { session } = useSession();
  const inspection = useInspection(inspectionId);
  const scaffold = useScaffold(inspection?.scaffoldId);
  const site = useLocalSite(inspection?.siteId);
  const findings = useFindingsOfInspection(inspectionId);
  const checks = useControlChecks(inspectionId);
  const finish = useFinishInspectionMutation();
  const [fields, setFields] = useState<ReportFields>();
  const [signature, setSignature] = useState<string | null>(null);
  const [issues, setIssues] = useState<Partial<Record<string, string>>>({});
  const [outcome, setOutcome] = useState<OutcomeFields>({ tagStatus: null, restriction: '', accessTagsChanged: null });
  // Signing over a prompt (e.g. cleared with a High finding open) takes a second, deliberate press.
  const [confirming, setConfirming] = useState(false);
  const scaffoldFindings = useFindingsOfScaffold(inspection?.scaffoldId);
  const openHigh = (scaffoldFindings ?? []).filter((f) => f.riskBand === 'High' && (f.state === 'open' || f.state === 'made-safe')).length;
  const prompts = outcomePrompts(outcome, openHigh);

  const ready = inspection && scaffold && site !== undefined && findings && checks && session;
  useEffect(() => {
    if (!ready || fields || !inspectionId) return;
    void readMeta<ReportFields>(db, draftKey(inspectionId)).then((saved) =>
      setFields(saved ?? draftReport({ site: site ?? undefined, scaffold, findings, checks, user: session.user, units })),
    );
  }, [ready, fields, inspectionId, site, scaffold, findings, checks, session, units]);

  const missing = checks ? unansweredControls(checks) : [];

  function update(name: keyof ReportFields, value: string) {
    setFields((current) => (current ? { ...current, [name]: value } : current));
  }

  function keepDraft() {
    if (fields && inspectionId) void writeMeta(db, draftKey(inspectionId), fields);
  }

  /** A one-line report field with its error; a render helper, not a component, so typing keeps focus. */
  function reportLine(name: 'reportFor' | 'reporterName' | 'reporterPosition', className?: string) {
    if (!fields) return null;
    return (
      <>
        <IonInput
          className={className}
          label={REPORT_FIELD_LABELS[name]}
          labelPlacement="stacked"
          fill="outline"
          value={fields[name]}
          onIonInput={(event) => update(name, String(event.detail.value ?? ''))}
          onIonBlur={keepDraft}
          data-testid={`report-${name}`}
        />
        {issues[name] && <IonNote color="danger" className="field-error">{issues[name]}</IonNote>}
      </>
    );
  }

  function submit() {
    if (!fields || !inspection) return;
    const parsed = InspectionFinishSchema.safeParse({ ...fields, signature, ...outcome });
    const outcomeFields = new Set(['tagStatus', 'restriction', 'accessTagsChanged']);
    const found: Partial<Record<string, string>> = parsed.success
      ? {}
      : Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), outcomeFields.has(String(issue.path[0])) ? issue.message : 'Fill this in.']));
    // The phone always asks for the outcome (the server also takes a finish queued before it did).
    if (outcome.tagStatus === null) found.tagStatus = 'Choose the tag status you give the scaffold.';
    if (!parsed.success || Object.keys(found).length > 0) {
      setIssues(found);
      return;
    }
    setIssues({});
    if (prompts.length > 0 && !confirming) {
      setConfirming(true);
      return;
    }
    finish.mutate(
      { inspectionId: inspection.id, report: parsed.data },
      {
        onSuccess: () => {
          void db.meta.delete(draftKey(inspection.id));
          router.push(`/scaffolds/${inspection.scaffoldId}`, 'root', 'replace');
        },
      },
    );
  }

  return (
    <IonPage>
      <AppHeader title="Finish and sign" backHref={inspectionId ? `/inspections/${inspectionId}` : '/'} />
      <IonContent className="ion-padding" data-testid="finish-page">
        <RequireSession>
          {() => (
            <div className="page-body">
              {inspection?.status === 'finished' && <p className="empty-note">This inspection is already finished and signed.</p>}
              {missing.length > 0 && (
                <p className="empty-note" role="alert" data-testid="controls-missing">
                  Answer every control check before signing. Still to answer: {missing.map((control) => CONTROL_WORDS[control].label).join(', ')}.
                </p>
              )}
              {fields && (
                <>
                  <FormSection title="The report">
                    <p className="muted">Drafted from your walk: read every line and change what needs changing. The date and time are set when you sign.</p>
                    {reportLine('reportFor')}
                    {LONG_FIELDS.map((name) => (
                      <label key={name} className="report-field">
                        <span className="select-field__label">{REPORT_FIELD_LABELS[name]}</span>
                        <textarea
                          className="plain-textarea"
                          rows={name === 'mattersGivingRisk' || name === 'furtherAction' ? 6 : 3}
                          value={fields[name]}
                          onChange={(event) => update(name, event.target.value)}
                          onBlur={keepDraft}
                          data-testid={`report-${name}`}
                        />
                        {issues[name] && <IonNote color="danger" className="field-error">{issues[name]}</IonNote>}
                      </label>
                    ))}
                  </FormSection>
                  <OutcomeSection
                    value={outcome}
                    onChange={(next) => (setOutcome(next), setConfirming(false))}
                    issues={issues}
                    prompts={prompts}
                    disabled={inspection?.status === 'finished'}
                  />
                  <FormSection title="Signed by">
                    {reportLine('reporterName')}
                    {reportLine('reporterPosition', 'report-field')}
                    <p className="select-field__label report-field">Drawn signature (optional)</p>
                    <SignaturePad value={signature} onChange={setSignature} />
                  </FormSection>
                  <CautionNote />
                </>
              )}
            </div>
          )}
        </RequireSession>
      </IonContent>
      <IonFooter>
        <div className="bottom-actions">
          <IonButton disabled={!fields || missing.length > 0 || finish.isPending || inspection?.status === 'finished'} onClick={submit} data-testid="sign-and-finish">
            {confirming ? 'Sign with this status anyway' : 'Finish and sign'}
          </IonButton>
        </div>
        {finish.isError && (
          <IonNote color="danger" className="field-error ion-padding-horizontal" role="alert">
            {finish.error.message}
          </IonNote>
        )}
      </IonFooter>
    </IonPage>
  );
}
