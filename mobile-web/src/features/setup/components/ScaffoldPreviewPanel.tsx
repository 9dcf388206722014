import { topPlatformHeightM } from '@plummet/shared';
import { useState } from 'react';
import { formatQuantity, type Units } from '../../../lib/units';
import { ElevationGrid } from '../../scaffolds/components/ElevationGrid';
import { previewOf, type ScaffoldForm } from '../scaffold-form';

/** The scaffold's drawing as the form stands, redrawn on every keystroke (a preview: nothing to tap). */
export function ScaffoldPreviewPanel({ form, units }: { form: ScaffoldForm; units: Units }) {
  const preview = previewOf(form, units);
  const [chosen, setChosen] = useState(0);
  const index = Math.min(chosen, preview.elevations.length - 1);
  const elevation = preview.elevations[index];
  return (
    <section className="setup-editor__preview" aria-label="Drawing preview" data-testid="scaffold-preview">
      <h2>Drawing</h2>
      <p className="setup-muted">
        {preview.lifts} lift{preview.lifts === 1 ? '' : 's'}, {preview.bays} bay{preview.bays === 1 ? '' : 's'} per elevation; top platform at{' '}
        {formatQuantity('height', topPlatformHeightM(preview), units)}.
      </p>
      {preview.elevations.length > 1 && (
        <div className="setup-toggles" role="group" aria-label="Elevation shown">
          {preview.elevations.map((name, i) => (
            <button key={`${name}-${i}`} type="button" aria-pressed={i === index} onClick={() => setChosen(i)}>
              {name}
            </button>
          ))}
        </div>
      )}
      <div inert>
        <ElevationGrid
          elevation={elevation}
          lifts={preview.lifts}
          bays={preview.bays}
          liftHeightM={preview.liftHeightM}
          liftHeightsM={preview.liftHeightsM}
          findings={[]}
          onSelect={() => undefined}
          units={units}
        />
      </div>
    </section>
  );
}
