import { IonInput } from '@ionic/react';
import { SHAPE_DIMENSIONS, SHAPE_KINDS, ORIENTATIONS, type Orientation } from '@plummet/shared';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { NumberField } from '../../../components/NumberField';
import type { CatalogueItemRecord } from '../../../local-db/records';
import { CatalogueSearch } from '../../catalogue/components/CatalogueSearch';
import { formatQuantity, unitLabel, type Units } from '../../../lib/units';
import type { FindingForm, FormReading, ItemMode, ShapeChoice } from '../finding-form';
import { describeShape, DIMENSION_WORDS, ORIENTATION_WORDS, SHAPE_WORDS } from '../finding-words';
import './ItemPicker.css';

interface ItemPickerProps {
  form: FindingForm;
  onChange(patch: Partial<FindingForm>): void;
  catalogue: readonly CatalogueItemRecord[];
  units: Units;
  problems: FormReading['problems'];
  showProblems: boolean;
}

const SHAPE_CHOICES: ShapeChoice[] = [...SHAPE_KINDS, 'unknown'];

/** The item: found in the catalogue as the inspector types, or described (mass, shape, size). */
export function ItemPicker({ form, onChange, catalogue, units, problems, showProblems }: ItemPickerProps) {
  const chosen = catalogue.find((item) => item.id === form.catalogueItemId);
  const sizeUnit = unitLabel('size', units);

  return (
    <div className="item-picker">
      <ChoiceGroup<ItemMode>
        legend="The item"
        value={form.itemMode}
        onChange={(itemMode) => onChange({ itemMode })}
        choices={[
          { value: 'catalogue', label: 'From the catalogue' },
          { value: 'custom', label: 'Describe it' },
        ]}
        testId="item-mode"
      />
      {form.itemMode === 'catalogue' ? (
        <>
          {chosen && (
            <div className="catalogue-search__chosen" data-testid="chosen-item">
              <strong>{chosen.name}</strong>
              <span>
                {formatQuantity('mass', chosen.massKg, units)} · {describeShape(chosen.shape, units)}
              </span>
              <span className="item-picker__source">Source: {chosen.source}</span>
            </div>
          )}
          <CatalogueSearch
            catalogue={catalogue}
            units={units}
            label={chosen ? 'Search for another item' : 'Search the catalogue'}
            placeholder="e.g. coupler, hammer, brick"
            noMatchHint="Try another word, or describe the item."
            onPick={(item) => onChange({ catalogueItemId: item.id })}
            searchTestId="item-search"
            hitsTestId="item-hits"
            hitTestId="item-hit"
          />
          {showProblems && problems.item && <p className="field-error item-picker__problem">{problems.item}</p>}
        </>
      ) : (
        <>
          <IonInput
            label="What is it?"
            labelPlacement="stacked"
            fill="outline"
            value={form.customName}
            placeholder="e.g. offcut of scaffold board"
            onIonInput={(event) => onChange({ customName: String(event.detail.value ?? '') })}
            data-testid="custom-name"
          />
          {showProblems && problems.name && <p className="field-error">{problems.name}</p>}
          <div className="item-picker__gap" />
          <NumberField label="Mass" unit={unitLabel('mass', units)} value={form.massText} onChange={(massText) => onChange({ massText })} error={showProblems || form.massText ? problems.mass : undefined} testId="custom-mass" />
          <ChoiceGroup<ShapeChoice>
            legend="Shape"
            value={form.shape}
            onChange={(shape) => onChange({ shape })}
            choices={SHAPE_CHOICES.map((value) => ({ value, label: SHAPE_WORDS[value] }))}
            testId="custom-shape"
          />
          {form.shape !== 'unknown' && (
            <>
              <div className="field-row">
                {SHAPE_DIMENSIONS[form.shape].map((field) => (
                  <NumberField
                    key={field}
                    label={DIMENSION_WORDS[field] ?? field}
                    unit={sizeUnit}
                    value={form.dimensionTexts[field] ?? ''}
                    onChange={(text) => onChange({ dimensionTexts: { ...form.dimensionTexts, [field]: text } })}
                    testId={`dimension-${field}`}
                  />
                ))}
              </div>
              {(showProblems || Object.values(form.dimensionTexts).some((text) => text !== '')) && problems.dimensions && (
                <p className="field-error">{problems.dimensions}</p>
              )}
              <ChoiceGroup<Orientation>
                legend="How it would fall"
                layout="stack"
                value={form.orientation}
                onChange={(orientation) => onChange({ orientation })}
                choices={ORIENTATIONS.map((value) => ({ value, ...ORIENTATION_WORDS[value] }))}
                testId="custom-orientation"
              />
            </>
          )}
          {form.shape === 'unknown' && <p className="muted">Without a shape the estimate ignores air drag: the fastest possible fall.</p>}
        </>
      )}
    </div>
  );
}
