import { FINDING_EXPOSURES, type FindingExposure } from '@plummet/shared';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { EXPOSURE_WORDS } from '../finding-words';

export function ExposureChoice({ value, onChange }: { value: FindingExposure; onChange(value: FindingExposure): void }) {
  return (
    <ChoiceGroup
      legend="Who could be struck below?"
      layout="stack"
      value={value}
      onChange={onChange}
      choices={FINDING_EXPOSURES.map((exposure) => ({ value: exposure, ...EXPOSURE_WORDS[exposure] }))}
      testId="exposure"
    />
  );
}
