import { IonButton, IonNote } from '@ionic/react';
import type { ExclusionZone } from '@plummet/shared';
import { useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { CautionNote } from '../../../components/CautionNote';
import { NumberField } from '../../../components/NumberField';
import { formatForInput, formatQuantity, unitLabel, windForInput, windUnitLabel, type Units, type WindUnits } from '../../../lib/units';
import { useOnlineStatus } from '../../../lib/use-online-status';
import { catalogueRecordOf } from '../../catalogue/catalogue-search';
import { CatalogueSearch } from '../../catalogue/components/CatalogueSearch';
import { fetchCatalogue } from '../../catalogue/catalogue.api';
import { useCatalogue } from '../../catalogue/catalogue.queries';
import { describeExclusionZone, readZoneForm } from '../exclusion-zone-view';
import { useExclusionZones, useSaveExclusionZoneMutation } from '../exclusion-zone.queries';
import '../../scaffolds/pages/ScaffoldPage.css';
import './ExclusionZoneSection.css';

interface SectionProps {
  scaffoldId: string;
  units: Units;
  windUnits: WindUnits;
  /** Foremen read the zone; inspectors, managers and admins set it. */
  canEdit: boolean;
}

/** The zone kept clear below each elevation: suggested from the height, the heaviest item and the wind. Online only. */
export function ExclusionZoneSection({ scaffoldId, units, windUnits, canEdit }: SectionProps) {
  const online = useOnlineStatus();
  const zones = useExclusionZones(scaffoldId);
  return (
    <section className="exclusion-zones" data-testid="exclusion-zones" aria-labelledby="exclusion-zones-heading">
      <h2 id="exclusion-zones-heading" className="exclusion-zones__heading">
        Exclusion zone
      </h2>
      {!online && !zones.data && (
        <IonNote color="medium" role="status" data-testid="exclusion-zone-offline" className="scaffold-summary">
          No connection: the exclusion zone is worked out on the server and needs a connection to show or change. Keep the barriers where they are.
        </IonNote>
      )}
      {online && zones.isPending && <p className="muted">Loading…</p>}
      {online && zones.isError && <p className="muted">The exclusion zone could not be loaded. Try again in a moment.</p>}
      {zones.data?.items.length === 0 && <p className="muted">This scaffold has no elevations recorded.</p>}
      {zones.data?.items.map((zone) => (
        <ZoneCard key={zone.elevation} zone={zone} units={units} windUnits={windUnits} canEdit={canEdit} online={online} />
      ))}
    </section>
  );
}

function ZoneCard({ zone, units, windUnits, canEdit, online }: { zone: ExclusionZone; units: Units; windUnits: WindUnits; canEdit: boolean; online: boolean }) {
  const view = describeExclusionZone(zone, units, windUnits);
  const [editing, setEditing] = useState(false);
  return (
    <article className="scaffold-summary exclusion-zone" data-testid="exclusion-zone" data-elevation={zone.elevation}>
      <h3 className="control-card__title">{view.title}</h3>
      <dl className="data-list">
        {view.facts.map(([label, value]) => (
          <div key={label}>
            <dt>{label}</dt>
            <dd>{value}</dd>
          </div>
        ))}
        <div>
          <dt>Barriered on site</dt>
          <dd data-testid="zone-barriered">{view.barriered}</dd>
        </div>
      </dl>
      {view.suggestion ? (
        <div className="exclusion-zone__suggestion" data-testid="zone-suggestion">
          <p className="exclusion-zone__width">
            Suggested width out from the face: <strong data-testid="zone-suggested-width">{view.suggestion.width}</strong>
          </p>
          <ul className="exclusion-zone__parts">
            {view.suggestion.parts.map((part) => (
              <li key={part}>{part}</li>
            ))}
          </ul>
          {view.comparison && (
            <p className={view.comparison.short ? 'exclusion-zone__short' : 'muted'} data-testid="zone-comparison">
              Barriered width: {view.comparison.words}.
            </p>
          )}
          <h4 className="exclusion-zone__rules-title">Rules of thumb by height, for comparison</h4>
          <ul className="exclusion-zone__rules">
            {view.suggestion.rules.map((rule) => (
              <li key={rule.label}>
                <span>
                  {rule.label}: <strong>{rule.width}</strong>
                </span>
                <span className="exclusion-zone__source">Source: {rule.source}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="muted" data-testid="zone-missing">
          {view.missing}
        </p>
      )}
      <p className="muted">The zone stays the same as findings are fixed: work above still drops things.</p>
      {canEdit &&
        (editing ? (
          <ZoneForm zone={zone} units={units} windUnits={windUnits} online={online} onDone={() => setEditing(false)} />
        ) : (
          <IonButton fill="outline" onClick={() => setEditing(true)} data-testid="edit-zone">
            Change item, wind or barriered width
          </IonButton>
        ))}
      <CautionNote />
    </article>
  );
}

function ZoneForm({ zone, units, windUnits, online, onDone }: { zone: ExclusionZone; units: Units; windUnits: WindUnits; online: boolean; onDone(): void }) {
  // The catalogue kept on the phone; at a desk where none is kept, the server's.
  const kept = useCatalogue();
  const fetched = useQuery({
    queryKey: ['catalogue', 'for-exclusion-zone'],
    queryFn: ({ signal }) => fetchCatalogue(signal),
    enabled: online && kept !== undefined && kept.length === 0,
    networkMode: 'online',
  });
  const catalogue = useMemo(() => (kept && kept.length > 0 ? kept : (fetched.data ?? []).map(catalogueRecordOf)), [kept, fetched.data]);
  const save = useSaveExclusionZoneMutation(zone.scaffoldId);
  const [itemId, setItemId] = useState<string | null>(zone.heaviestItem?.id ?? null);
  const [windText, setWindText] = useState(windForInput(zone.limitingWindMps, windUnits));
  const [widthText, setWidthText] = useState(zone.barrieredWidthM === null ? '' : formatForInput('distance', zone.barrieredWidthM, units));
  const chosen = catalogue.find((item) => item.id === itemId) ?? (zone.heaviestItem?.id === itemId ? zone.heaviestItem : undefined);
  const { body, problems } = readZoneForm({ heaviestItemId: itemId, windText, widthText }, units, windUnits);

  return (
    <div className="exclusion-zone__form" data-testid="zone-form">
      {chosen && (
        <p className="catalogue-search__chosen" data-testid="zone-chosen-item">
          <strong>{chosen.name}</strong> <span>{formatQuantity('mass', chosen.massKg, units)}</span>
        </p>
      )}
      <CatalogueSearch
        catalogue={catalogue}
        units={units}
        label={chosen ? 'Heaviest item: search for another' : 'Heaviest item handled there: search the catalogue'}
        placeholder="e.g. board, tube, clip"
        noMatchHint="Try another word."
        onPick={(item) => setItemId(item.id)}
        searchTestId="zone-item-search"
        hitTestId="zone-item-hit"
      />
      <NumberField
        label="Limiting wind speed: work at height stops above"
        unit={windUnitLabel(windUnits)}
        value={windText}
        onChange={setWindText}
        error={problems.wind}
        testId="zone-wind"
      />
      <NumberField
        label="Width barriered on site, out from the face"
        unit={unitLabel('distance', units)}
        value={widthText}
        onChange={setWidthText}
        error={problems.width}
        testId="zone-width"
      />
      {!online && (
        <IonNote color="danger" role="alert">
          No connection: this cannot be saved from the phone now. Try again when back in signal.
        </IonNote>
      )}
      <div className="bottom-actions">
        <IonButton fill="clear" onClick={onDone}>
          Cancel
        </IonButton>
        <IonButton disabled={!online || body === null || save.isPending} onClick={() => body && save.mutate({ elevation: zone.elevation, body }, { onSuccess: onDone })} data-testid="save-zone">
          Save
        </IonButton>
      </div>
    </div>
  );
}

