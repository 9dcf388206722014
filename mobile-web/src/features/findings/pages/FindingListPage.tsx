import { IonContent, IonPage } from '@ionic/react';
import type { RiskBand } from '@plummet/shared';
import { useMemo, useState } from 'react';
import { useParams } from 'react-router-dom';
import { AppHeader } from '../../../components/AppHeader';
import { TabBar } from '../../../components/TabBar';
import { VirtualList } from '../../../components/VirtualList';
import { RequireSession } from '../../auth/components/RequireSession';
import { useUnits } from '../../auth/session.queries';
import { useScaffoldsOfSite } from '../../scaffolds/scaffolds.queries';
import { useLocalSite } from '../../sites/sites.queries';
import { FindingRow } from '../components/FindingRow';
import { groupByScaffoldAndLift, matchesSearch } from '../finding-groups';
import { useFindingsOfSite } from '../findings.queries';
import './FindingListPage.css';

const ROW_HEIGHT = 88;
type Filter = 'all' | RiskBand;

/** Every finding of a site on the phone, highest risk first; virtualised for thousands of rows. */
export function FindingListPage() {
  const { siteId } = useParams();
  const units = useUnits();
  const site = useLocalSite(siteId);
  const findings = useFindingsOfSite(siteId);
  const scaffolds = useScaffoldsOfSite(siteId);
  const [filter, setFilter] = useState<Filter>('all');
  const [search, setSearch] = useState('');
  const references = useMemo(() => new Map((scaffolds ?? []).map((s) => [s.id, s.reference])), [scaffolds]);
  const shown = useMemo(
    () => (findings ?? []).filter((f) => (filter === 'all' || f.riskBand === filter) && matchesSearch(f, search)),
    [findings, filter, search],
  );
  const entries = useMemo(() => groupByScaffoldAndLift(shown, (id) => references.get(id) ?? 'Scaffold'), [shown, references]);
  const count = (band: RiskBand) => (findings ?? []).filter((f) => f.riskBand === band).length;

  return (
    <IonPage>
      <AppHeader title={site ? `Findings · ${site.name}` : 'Findings'} backHref={siteId ? `/sites/${siteId}` : '/'}>
        <TabBar<Filter>
          label="Filter by risk band"
          value={filter}
          onChange={setFilter}
          tabs={[
            { value: 'all', label: `All ${findings?.length ?? ''}` },
            { value: 'High', label: `High ${count('High')}` },
            { value: 'Medium', label: `Medium ${count('Medium')}` },
            { value: 'Low', label: `Low ${count('Low')}` },
          ]}
        />
        <div className="finding-search">
          <label htmlFor="finding-search" className="visually-hidden">
            Search findings by item
          </label>
          <input
            id="finding-search"
            type="search"
            className="finding-search__input"
            placeholder="Search by item, e.g. clip"
            value={search}
            onChange={(event) => setSearch(event.target.value)}
            data-testid="finding-search"
          />
        </div>
      </AppHeader>
      <IonContent scrollY={false} data-testid="finding-list-page">
        <RequireSession>
          {() =>
            shown.length === 0 ? (
              <p className="empty-note ion-margin">{findings === undefined ? 'Opening…' : search ? 'No item matches that search.' : 'No findings here.'}</p>
            ) : (
              <VirtualList
                items={entries}
                rowHeight={ROW_HEIGHT}
                rowKey={(entry) => entry.key}
                renderRow={(entry) =>
                  entry.kind === 'heading' ? (
                    <h2 className="finding-group" data-testid="finding-group">
                      {entry.text} <span className="finding-group__count">· {entry.count === 1 ? '1 finding' : `${entry.count} findings`}</span>
                    </h2>
                  ) : (
                    <FindingRow finding={entry.finding} units={units} />
                  )
                }
                label="Findings by scaffold and lift, highest risk first"
                testId="finding-list"
              />
            )
          }
        </RequireSession>
      </IonContent>
    </IonPage>
  );
}
