import { IonButton, IonIcon } from '@ionic/react';
import { addCircleOutline } from 'ionicons/icons';
import { useState } from 'react';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import type { FindingRecord, ScaffoldRecord } from '../../../local-db/records';
import { FindingRow } from '../../findings/components/FindingRow';
import type { Units } from '../../../lib/units';
import type { GridSpot } from '../elevation-grid';
import { ElevationGrid } from './ElevationGrid';

interface ScaffoldElevationsProps {
  scaffold: ScaffoldRecord;
  findings: readonly FindingRecord[];
  units: Units;
  /** During a walk: adds a finding at the tapped bay. */
  onAddFinding?(spot: GridSpot): void;
}

/** The elevation picker, the drawing with its pinned findings, and what the tapped bay holds. */
export function ScaffoldElevations({ scaffold, findings, units, onAddFinding }: ScaffoldElevationsProps) {
  const [elevation, setElevation] = useState(scaffold.elevations[0] ?? '');
  const [selected, setSelected] = useState<GridSpot>();
  const inCell = selected ? findings.filter((f) => f.elevation === selected.elevation && f.lift === selected.lift && f.bay === selected.bay) : [];

  return (
    <div className="scaffold-elevations">
      {scaffold.elevations.length > 1 && (
        <ChoiceGroup
          legend="Elevation"
          value={elevation}
          choices={scaffold.elevations.map((name) => ({ value: name, label: name }))}
          onChange={(name) => {
            setElevation(name);
            setSelected(undefined);
          }}
          testId="elevation-picker"
        />
      )}
      <ElevationGrid
        elevation={elevation}
        lifts={scaffold.lifts}
        bays={scaffold.baysPerElevation}
        liftHeightM={scaffold.liftHeightM}
        liftHeightsM={scaffold.liftHeightsM}
        findings={findings}
        selected={selected}
        onSelect={setSelected}
        units={units}
      />
      <div className="grid-legend" aria-label="Risk bands">
        <span className="risk-badge risk-badge--high risk-badge--compact">High</span> 12–25
        <span className="risk-badge risk-badge--medium risk-badge--compact">Medium</span> 5–10
        <span className="risk-badge risk-badge--low risk-badge--compact">Low</span> 1–4
      </div>
      {selected && (
        <section className="cell-panel" data-testid="cell-panel" aria-live="polite">
          <h2 className="cell-panel__title">
            {selected.elevation}, lift {selected.lift}, bay {selected.bay}
          </h2>
          {inCell.length === 0 ? (
            <p className="muted">No findings here.</p>
          ) : (
            <div className="cell-panel__list">
              {inCell.map((finding) => (
                <FindingRow key={finding.id} finding={finding} units={units} />
              ))}
            </div>
          )}
          {onAddFinding && (
            <IonButton expand="block" onClick={() => onAddFinding(selected)} data-testid="add-finding-here">
              <IonIcon slot="start" icon={addCircleOutline} aria-hidden="true" />
              Add a finding here
            </IonButton>
          )}
        </section>
      )}
    </div>
  );
}
