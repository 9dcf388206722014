import { mustBeMadeSafeNow, type Foreman } from '@plummet/shared';
import { IonButton, IonContent, IonFooter, useIonRouter } from '@ionic/react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { AppHeader } from '../../../components/AppHeader';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { FormSection } from '../../../components/FormSection';
import { NumberField } from '../../../components/NumberField';
import { SelectField } from '../../../components/SelectField';
import { Stepper } from '../../../components/Stepper';
import { Switch } from '../../../components/Switch';
import type { CatalogueItemRecord, FindingRecord, PhotoRecord, ScaffoldRecord } from '../../../local-db/records';
import { PhotoPicker } from '../../photos/components/PhotoPicker';
import type { PendingPhoto } from '../../photos/photos.store';
import { formatQuantity, unitLabel, type Units } from '../../../lib/units';
import { heightOfLift, readFindingForm, type FindingForm, type HeightMode } from '../finding-form';
import { buildFindingRecord, tryEstimate, type FindingOwner } from '../finding-record';
import { useWindUnits } from '../../auth/session.queries';
import { useSaveFindingMutation } from '../findings.mutations';
import type { FindingLock } from '../finding-lock';
import { EstimatePanel, EstimateStrip } from './EstimatePanel';
import { ExposureChoice } from './ExposureChoice';
import { HowComputedSheet } from './HowComputedSheet';
import { ItemPicker } from './ItemPicker';
import { LikelihoodQuestions } from './LikelihoodQuestions';

interface FindingEditorProps {
  initialForm: FindingForm;
  existing?: FindingRecord;
  owner: FindingOwner;
  scaffold: ScaffoldRecord;
  catalogue: readonly CatalogueItemRecord[];
  storedPhotos: readonly PhotoRecord[];
  windSpeedMps: number | null;
  units: Units;
  backHref: string;
  /** Set when the editor is read-only: why, and the fix loop's page where the finding is made safe or fixed. */
  lock: FindingLock | null;
  /** The organisation's foremen, to give the finding to one (empty: the choice is hidden). */
  foremen?: readonly Foreman[];
}


/**
 * The finding form. The estimate is computed in render from the form (shared estimateFinding →
 * assessDrop, synchronous, no debounce), so it follows every keystroke within the same frame.
 */
export function FindingEditor({ initialForm, existing, owner, scaffold, catalogue, storedPhotos, windSpeedMps, units, backHref, lock, foremen = [] }: FindingEditorProps) {
  const router = useIonRouter();
  const save = useSaveFindingMutation();
  const windUnits = useWindUnits();
  const [form, setForm] = useState(initialForm);
  const [pending, setPending] = useState<PendingPhoto[]>([]);
  const [explaining, setExplaining] = useState(false);
  const [showProblems, setShowProblems] = useState(false);
  const [assigneeId, setAssigneeId] = useState<string>(existing?.assigneeId ?? '');
  // Asked once per save: a High finding with people below is made safe before the inspector leaves the bay.
  const [askedToMakeSafe, setAskedToMakeSafe] = useState(false);
  const patch = (changes: Partial<FindingForm>) => setForm((current) => ({ ...current, ...changes }));

  const catalogueItem = catalogue.find((item) => item.id === form.catalogueItemId);
  const reading = readFindingForm(form, { units, liftHeightM: scaffold.liftHeightM, liftHeightsM: scaffold.liftHeightsM, windSpeedMps, catalogueItem });
  const { result, problem } = tryEstimate(reading.input);
  const firstProblem = Object.values(reading.problems)[0];
  const liftHeight = heightOfLift(form.lift, scaffold.liftHeightM, scaffold.liftHeightsM);
  const wasMadeSafe = existing?.state === 'made-safe';

  const leave = () => (router.canGoBack() ? router.goBack() : router.push(backHref, 'back', 'replace'));

  function submit() {
    if (!reading.item || !reading.input || !result || firstProblem) {
      setShowProblems(true);
      return;
    }
    const built = buildFindingRecord(owner, form, reading.item, reading.input, result, existing, new Date());
    const finding = { ...built, assigneeId: assigneeId || null, handBack: assigneeId && assigneeId !== existing?.assigneeId ? null : built.handBack };
    if (!existing && finding.state === 'open' && mustBeMadeSafeNow(finding.riskBand, finding.exposure) && !askedToMakeSafe) {
      setAskedToMakeSafe(true);
      return;
    }
    save.mutate(
      { finding, photos: pending },
      { onSuccess: leave },
    );
  }

  return (
    <>
      <AppHeader title={existing ? existing.item.name : 'New finding'} backHref={backHref}>
        <EstimateStrip result={result} units={units} />
      </AppHeader>
      <IonContent className="ion-padding" data-testid="finding-editor">
        <div className="page-body">
          {lock && (
            <p className="empty-note" data-testid="finding-read-only">
              {lock.reason}{' '}
              <Link to={lock.fixHref} data-testid="finding-fix-link">
                Open the fix list
              </Link>
            </p>
          )}
          <FormSection title="Photos">
            <PhotoPicker
              stored={storedPhotos}
              pending={pending}
              onAdd={(photo) => setPending((all) => [...all, photo])}
              onRemovePending={(id) => setPending((all) => all.filter((photo) => photo.id !== id))}
              testId="finding-photos"
            />
          </FormSection>

          <FormSection title="Where">
            {/* One above the other: each stepper needs the full width for its 56 px buttons. */}
            <div>
              <SelectField label="Elevation" value={form.elevation} onChange={(elevation) => patch({ elevation })} options={scaffold.elevations.map((e) => ({ value: e, label: e }))} testId="where-elevation" />
              <Stepper label="Lift" value={form.lift} min={1} max={scaffold.lifts} onChange={(lift) => patch({ lift })} testId="where-lift" />
              <Stepper label="Bay" value={form.bay} min={1} max={scaffold.baysPerElevation} onChange={(bay) => patch({ bay })} testId="where-bay" />
            </div>
            <ChoiceGroup<HeightMode>
              legend="Height it could fall"
              value={form.heightMode}
              onChange={(heightMode) => patch({ heightMode })}
              choices={[
                { value: 'lift', label: `From lift ${form.lift}`, hint: formatQuantity('height', liftHeight, units) },
                { value: 'measured', label: 'Measured', hint: 'To where it would land' },
              ]}
              testId="height-mode"
            />
            {form.heightMode === 'measured' && (
              <NumberField
                label="Measured height"
                unit={unitLabel('height', units)}
                value={form.heightText}
                onChange={(heightText) => patch({ heightText })}
                error={showProblems || form.heightText ? reading.problems.height : undefined}
                helper="From the item down to where someone could be struck."
                testId="measured-height"
              />
            )}
          </FormSection>

          <FormSection title="Item">
            <ItemPicker form={form} onChange={patch} catalogue={catalogue} units={units} problems={reading.problems} showProblems={showProblems} />
          </FormSection>

          <FormSection title="Below">
            <ExposureChoice value={form.exposure} onChange={(exposure) => patch({ exposure })} />
          </FormSection>

          <FormSection title="How likely is a fall and a strike?">
            <LikelihoodQuestions answers={form.answers} onChange={(answers) => patch({ answers })} />
          </FormSection>

          <EstimatePanel result={result} waitingFor={problem ?? firstProblem} windSpeedMps={windSpeedMps} units={units} windUnits={windUnits} onExplain={() => setExplaining(true)} />

          <FormSection title="Notes and action">
            <label>
              <span className="select-field__label">Notes</span>
              <textarea className="plain-textarea" value={form.notes} onChange={(event) => patch({ notes: event.target.value })} data-testid="finding-notes" />
            </label>
            <Switch
              label={wasMadeSafe ? 'Made safe' : 'Made safe now'}
              checked={form.madeSafe}
              disabled={wasMadeSafe}
              onChange={(madeSafe) => patch({ madeSafe })}
              testId="made-safe"
            />
            {form.madeSafe && (
              <label>
                <span className="select-field__label">How was it made safe?</span>
                <textarea
                  className="plain-textarea"
                  value={form.madeSafeNote}
                  disabled={wasMadeSafe}
                  placeholder="e.g. bagged and lowered to the ground"
                  onChange={(event) => patch({ madeSafeNote: event.target.value })}
                  data-testid="made-safe-note"
                />
                {showProblems && reading.problems.madeSafeNote && <p className="field-error">{reading.problems.madeSafeNote}</p>}
              </label>
            )}
          </FormSection>
          {foremen.length > 0 && (
            <FormSection title="Who fixes it">
              <SelectField<string>
                label="Give to foreman"
                value={assigneeId}
                onChange={(value) => setAssigneeId(String(value))}
                options={[{ value: '', label: 'Nobody yet (the scaffold’s foreman)' }, ...foremen.map((f) => ({ value: f.id, label: f.position ? `${f.name}, ${f.position}` : f.name }))]}
                testId="finding-assignee"
              />
            </FormSection>
          )}
          {askedToMakeSafe && !form.madeSafe && (
            <div className="make-safe-now" role="alert" data-testid="make-safe-prompt">
              <p>
                <strong>Make it safe before you leave this bay.</strong> This is a High finding with people below: secure or
                remove the item, or close the zone underneath, and record what you did.
              </p>
              <div className="bottom-actions">
                <IonButton onClick={() => patch({ madeSafe: true })} data-testid="make-safe-prompt-yes">
                  Record it made safe
                </IonButton>
                <IonButton fill="outline" disabled={save.isPending} onClick={submit} data-testid="make-safe-prompt-later">
                  Save, still open
                </IonButton>
              </div>
            </div>
          )}
          {showProblems && firstProblem && (
            <p className="field-error" role="alert">
              Not saved yet: {firstProblem}
            </p>
          )}
        </div>
        <HowComputedSheet isOpen={explaining} onClose={() => setExplaining(false)} input={reading.input} result={result} />
      </IonContent>
      <IonFooter>
        <div className="bottom-actions">
          <IonButton fill="outline" onClick={leave}>
            Cancel
          </IonButton>
          <IonButton disabled={save.isPending || lock !== null} onClick={submit} data-testid="save-finding">
            {existing ? 'Save changes' : 'Save finding'}
          </IonButton>
        </div>
      </IonFooter>
    </>
  );
}
