import { IonInput } from '@ionic/react';
import { useMemo, useState } from 'react';
import type { CatalogueItemRecord } from '../../../local-db/records';
import { formatQuantity, type Units } from '../../../lib/units';
import { searchCatalogue } from '../catalogue-search';
import './CatalogueSearch.css';

interface CatalogueSearchProps {
  catalogue: readonly CatalogueItemRecord[];
  units: Units;
  label: string;
  placeholder: string;
  /** Said when nothing matches, after "Nothing matches." */
  noMatchHint: string;
  onPick(item: CatalogueItemRecord): void;
  /** Test ids of the field, of each match and (optionally) of the list of matches. */
  searchTestId: string;
  hitTestId: string;
  hitsTestId?: string;
}

/** A search field over the catalogue with its matches as large buttons; picking one clears the field. */
export function CatalogueSearch({ catalogue, units, label, placeholder, noMatchHint, onPick, searchTestId, hitTestId, hitsTestId }: CatalogueSearchProps) {
  const [query, setQuery] = useState('');
  const hits = useMemo(() => searchCatalogue(catalogue, query), [catalogue, query]);
  return (
    <>
      <IonInput
        label={label}
        labelPlacement="stacked"
        fill="outline"
        type="search"
        placeholder={placeholder}
        value={query}
        onIonInput={(event) => setQuery(String(event.detail.value ?? ''))}
        data-testid={searchTestId}
      />
      {query.trim() !== '' && (
        <ul className="catalogue-search__hits" data-testid={hitsTestId}>
          {hits.length === 0 && <li className="muted catalogue-search__none">Nothing matches. {noMatchHint}</li>}
          {hits.map((item) => (
            <li key={item.id}>
              <button
                type="button"
                className="catalogue-search__hit"
                onClick={() => {
                  onPick(item);
                  setQuery('');
                }}
                data-testid={hitTestId}
              >
                <span className="catalogue-search__hit-name">{item.name}</span>
                <span className="catalogue-search__hit-mass">{formatQuantity('mass', item.massKg, units)}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
