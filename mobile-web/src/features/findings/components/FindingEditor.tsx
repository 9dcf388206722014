import { IonButton, IonContent, IonFooter, useIonRouter } from '@ionic/react';
import { useState } from 'react';
import { AppHeader } from '../../../components/AppHeader';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { FormSection } from '../../../components/FormSection';
import { NumberField } from '../../../components/NumberField';
import { SelectField } from '../../../components/SelectField';
import { Switch } from '../../../components/Switch';
import type { CatalogueItemRecord, FindingRecord, PhotoRecord, ScaffoldRecord } from '../../../local-db/records';
import { PhotoPicker } from '../../photos/components/PhotoPicker';
import type { PendingPhoto } from '../../photos/photos.store';
import { formatQuantity, unitLabel, type Units } from '../../../lib/units';
import { heightOfLift, readFindingForm, type FindingForm, type HeightMode } from '../finding-form';
import { buildFindingRecord, tryEstimate, type FindingOwner } from '../finding-record';
import { useSaveFindingMutation } from '../findings.mutations';
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
  readOnly: boolean;
}

const range = (n: number) => Array.from({ length: n }, (_, i) => i + 1);

/**
 * The finding form. The estimate is computed in render from the form (shared estimateFinding →
 * assessDrop, synchronous, no debounce), so it follows every keystroke within the same frame.
 */
export function FindingEditor({ initialForm, existing, owner, scaffold, catalogue, storedPhotos, windSpeedMps, units, backHref, readOnly }: FindingEditorProps) {
  const router = useIonRouter();
  const save = useSaveFindingMutation();
  const [form, setForm] = useState(initialForm);
  const [pending, setPending] = useState<PendingPhoto[]>([]);
  const [explaining, setExplaining] = useState(false);
  const [showProblems, setShowProblems] = useState(false);
  const patch = (changes: Partial<FindingForm>) => setForm((current) => ({ ...current, ...changes }));

  const catalogueItem = catalogue.find((item) => item.id === form.catalogueItemId);
  const reading = readFindingForm(form, { units, liftHeightM: scaffold.liftHeightM, windSpeedMps, catalogueItem });
  const { result, problem } = tryEstimate(reading.input);
  const firstProblem = Object.values(reading.problems)[0];
  const liftHeight = heightOfLift(form.lift, scaffold.liftHeightM);
  const wasMadeSafe = existing?.state === 'made-safe';

  const leave = () => (router.canGoBack() ? router.goBack() : router.push(backHref, 'back', 'replace'));

  function submit() {
    if (!reading.item || !reading.input || !result || firstProblem) {
      setShowProblems(true);
      return;
    }
    const finding = buildFindingRecord(owner, form, reading.item, reading.input, result, existing, new Date());
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
          {readOnly && (
            <p className="empty-note" data-testid="finding-read-only">
              This finding belongs to a signed inspection, so it cannot be changed here; its fix goes through the fix list.
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
            <div className="field-row">
              <SelectField label="Elevation" value={form.elevation} onChange={(elevation) => patch({ elevation })} options={scaffold.elevations.map((e) => ({ value: e, label: e }))} testId="where-elevation" />
              <SelectField label="Lift" value={form.lift} onChange={(lift) => patch({ lift })} options={range(scaffold.lifts).map((n) => ({ value: n, label: String(n) }))} testId="where-lift" />
              <SelectField label="Bay" value={form.bay} onChange={(bay) => patch({ bay })} options={range(scaffold.baysPerElevation).map((n) => ({ value: n, label: String(n) }))} testId="where-bay" />
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

          <EstimatePanel result={result} waitingFor={problem ?? firstProblem} windSpeedMps={windSpeedMps} units={units} onExplain={() => setExplaining(true)} />

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
          <IonButton disabled={save.isPending || readOnly} onClick={submit} data-testid="save-finding">
            {existing ? 'Save changes' : 'Save finding'}
          </IonButton>
        </div>
      </IonFooter>
    </>
  );
}
