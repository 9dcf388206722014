import { IonContent, IonPage } from '@ionic/react';
import { LIKELIHOOD_QUESTIONS, LIMITS } from '@plummet/shared';
import { useMemo, useState } from 'react';
import { AppHeader } from '../../../components/AppHeader';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { FormSection } from '../../../components/FormSection';
import { NumberField } from '../../../components/NumberField';
import { useUnits, useWindUnits } from '../../auth/session.queries';
import { useCatalogue } from '../../catalogue/catalogue.queries';
import { EstimatePanel, EstimateStrip } from '../../findings/components/EstimatePanel';
import { ExposureChoice } from '../../findings/components/ExposureChoice';
import { HowComputedSheet } from '../../findings/components/HowComputedSheet';
import { ItemPicker } from '../../findings/components/ItemPicker';
import { readFindingForm, windAnswerFor, type FindingForm } from '../../findings/finding-form';
import { formatQuantity, parseQuantity, parseWind, unitLabel, windUnitLabel } from '../../../lib/units';
import { WhatIfTable } from '../components/WhatIfTable';
import { builtinCatalogue, newCalculatorForm } from '../calculator-form';
import { whatIfs } from '../what-if';

const QUESTIONS_ASKED = ['securing', 'edgeDistance', 'footTraffic'] as const;

/** What-ifs with no record: an item, a height, the wind and who is below; what each control changes. */
export function CalculatorPage() {
  const units = useUnits();
  const windUnits = useWindUnits();
  const stored = useCatalogue();
  const catalogue = useMemo(() => (stored && stored.length > 0 ? stored : builtinCatalogue()), [stored]);
  const [form, setForm] = useState<FindingForm>(newCalculatorForm);
  const [windText, setWindText] = useState('');
  const [lowerText, setLowerText] = useState('');
  const [explaining, setExplaining] = useState(false);
  const patch = (changes: Partial<FindingForm>) => setForm((current) => ({ ...current, ...changes }));

  const wind = windText.trim() === '' ? null : parseWind(windText, windUnits);
  const windSpeedMps = wind !== undefined && wind !== null && wind >= 0 && wind <= LIMITS.windMaxMps ? wind : null;
  const answers = { ...form.answers, wind: windAnswerFor(windSpeedMps) };
  const catalogueItem = catalogue.find((item) => item.id === form.catalogueItemId);
  const reading = readFindingForm({ ...form, answers }, { units, liftHeightM: 2, windSpeedMps, catalogueItem });
  const lowerBy = parseQuantity('height', lowerText, units) ?? 2;
  const scenarios = reading.input ? whatIfs(reading.input, lowerBy, `Lowered by ${formatQuantity('height', lowerBy, units)}`) : [];
  const now = scenarios[0]?.result;

  return (
    <IonPage>
      <AppHeader title="Quick estimate" backHref="/">
        <EstimateStrip result={now} units={units} />
      </AppHeader>
      <IonContent className="ion-padding" data-testid="calculator-page">
        <div className="page-body">
          <p className="muted">Try an item and a height; nothing here is saved. Then see what each control would change.</p>
          <FormSection title="Item">
            <ItemPicker form={form} onChange={patch} catalogue={catalogue} units={units} problems={reading.problems} showProblems={false} />
          </FormSection>
          <FormSection title="Height and wind">
            <NumberField
              label="Height it could fall"
              unit={unitLabel('height', units)}
              value={form.heightText}
              onChange={(heightText) => patch({ heightText })}
              error={form.heightText ? reading.problems.height : undefined}
              testId="calc-height"
            />
            <NumberField
              label="Wind speed"
              unit={windUnitLabel(windUnits)}
              value={windText}
              onChange={setWindText}
              error={wind === undefined ? 'Enter a number, or leave it empty.' : undefined}
              helper={`Empty for still air. Counts as ${answers.wind} for the likelihood.`}
              testId="calc-wind"
            />
          </FormSection>
          <FormSection title="Below and around it">
            <ExposureChoice value={form.exposure} onChange={(exposure) => patch({ exposure })} />
            {LIKELIHOOD_QUESTIONS.filter((question) => (QUESTIONS_ASKED as readonly string[]).includes(question.id)).map((question) => (
              <ChoiceGroup
                key={question.id}
                legend={question.text}
                layout="stack"
                value={form.answers[question.id]}
                onChange={(answer) => patch({ answers: { ...form.answers, [question.id]: answer } as FindingForm['answers'] })}
                choices={question.answers.map((answer) => ({ value: answer.id, label: answer.label }))}
                testId={`calc-${question.id}`}
              />
            ))}
          </FormSection>
          {now && (
            <FormSection title="What if…" testId="what-if-section">
              <NumberField
                label="Lower it by"
                unit={unitLabel('height', units)}
                value={lowerText}
                placeholder={formatQuantity('height', 2, units).split(' ')[0]}
                onChange={setLowerText}
                helper="One lift is usually 2 m (common practice, no source)."
                testId="calc-lower-by"
              />
              <WhatIfTable scenarios={scenarios} units={units} />
            </FormSection>
          )}
          <EstimatePanel result={now} waitingFor={Object.values(reading.problems)[0]} windSpeedMps={windSpeedMps} units={units} windUnits={windUnits} onExplain={() => setExplaining(true)} />
        </div>
        <HowComputedSheet isOpen={explaining} onClose={() => setExplaining(false)} input={reading.input} result={now} />
      </IonContent>
    </IonPage>
  );
}
