import type { FindingListItem } from '@plummet/shared';
import { useTable, type ColumnVisibilityState, type RowSelectionState, type SortingState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useSession, useUnits } from '../../auth/session.queries';
import { FindingFiltersBar } from '../components/FindingFiltersBar';
import { findingsColumns, findingsTableFeatures } from '../components/findings-columns';
import { ManagerLayout } from '../components/ManagerLayout';
import { TableScroll } from '../components/TableScroll';
import { readColumnChoice, saveColumnChoice } from '../column-choice';
import { filtersFromSearch, filtersToSearch, SORTABLE, type FindingFilters } from '../finding-filters';
import { downloadFindingsCsv } from '../manager.api';
import { useAssignFindingsMutation } from '../manager.mutations';
import { useFindingsTable, useMembers, useScaffolds } from '../manager.queries';

/** The heading a stacked card shows before a value (none for the selection box and the item, which speak for themselves). */
function cellLabel(id: string, header: unknown): string | undefined {
  return id === 'select' || id === 'item' || typeof header !== 'string' ? undefined : header;
}

/** Every finding of the organisation, filtered and sorted by the server, a page of 50 at a time. */
export function FindingsTablePage() {
  const [search, setSearch] = useSearchParams();
  const navigate = useNavigate();
  const filters = useMemo(() => filtersFromSearch(search), [search]);
  const userId = useSession().session?.user.id ?? '';
  const units = useUnits();
  const scaffolds = useScaffolds();
  const members = useMembers();
  const query = useFindingsTable(filters);
  const assign = useAssignFindingsMutation();
  const [columnVisibility, setColumnVisibility] = useState<ColumnVisibilityState>(() => readColumnChoice(userId));
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const [assignee, setAssignee] = useState('');
  const [exporting, setExporting] = useState<string | null>(null);

  const rows = useMemo(() => query.data?.pages.flatMap((p) => p.items) ?? [], [query.data]);
  const columns = useMemo(
    () =>
      findingsColumns({
        units,
        scaffolds: new Map(scaffolds.data?.map((s) => [s.id, s]) ?? []),
        members: new Map(members.data?.map((m) => [m.id, m]) ?? []),
      }),
    [units, scaffolds.data, members.data],
  );
  const sorting: SortingState = [{ id: filters.sort, desc: filters.order === 'desc' }];
  const update = (next: FindingFilters) => {
    setRowSelection({});
    setSearch(filtersToSearch(next), { replace: true });
  };

  const table = useTable<typeof findingsTableFeatures, FindingListItem>({
    features: findingsTableFeatures,
    columns,
    data: rows,
    getRowId: (f) => f.id,
    manualSorting: true,
    enableMultiSort: false,
    state: { sorting, columnVisibility, rowSelection },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first && SORTABLE.includes(first.id as FindingFilters['sort'])) update({ ...filters, sort: first.id as FindingFilters['sort'], order: first.desc ? 'desc' : 'asc' });
      else update({ ...filters, order: filters.order === 'desc' ? 'asc' : 'desc' });
    },
    onColumnVisibilityChange: (updater) => {
      const next = typeof updater === 'function' ? updater(columnVisibility) : updater;
      setColumnVisibility(next);
      saveColumnChoice(userId, next);
    },
    onRowSelectionChange: setRowSelection,
  });

  const selected = Object.keys(rowSelection).filter((id) => rowSelection[id]);

  async function exportCsv() {
    setExporting('Preparing the file…');
    try {
      await downloadFindingsCsv(filters);
      setExporting('The file is downloaded.');
    } catch (error) {
      setExporting(error instanceof Error ? error.message : 'The export failed.');
    }
  }

  return (
    <ManagerLayout title="Findings" loadedAt={query.dataUpdatedAt} refreshFailed={query.isError} testId="findings-table-page">
      <FindingFiltersBar key={search.toString()} filters={filters} onChange={update} />
      <div className="manager-actions">
        <button type="button" onClick={() => void exportCsv()} data-testid="export-csv">
          Export CSV
        </button>
        {exporting && <span role="status">{exporting}</span>}
        <details>
          <summary>Columns</summary>
          {table.getAllLeafColumns().filter((c) => c.getCanHide()).map((c) => (
            <label key={c.id} style={{ display: 'block' }}>
              <input type="checkbox" checked={c.getIsVisible()} onChange={c.getToggleVisibilityHandler()} data-testid={`column-${c.id}`} />{' '}
              {typeof c.columnDef.header === 'string' ? c.columnDef.header : c.id}
            </label>
          ))}
        </details>
      </div>
      {selected.length > 0 && (
        <div className="manager-actions" role="region" aria-label="Selected findings">
          <span>{selected.length} selected</span>
          <label>
            Assign to{' '}
            <select value={assignee} onChange={(e) => setAssignee(e.target.value)} data-testid="bulk-assignee">
              <option value="">Choose a foreman</option>
              {members.data?.filter((m) => m.role === 'foreman').map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
            </select>
          </label>
          <button type="button" disabled={!assignee || assign.isPending} data-testid="bulk-assign"
            onClick={() => assign.mutate({ ids: selected, assigneeId: assignee, dueAt: null }, { onSuccess: () => setRowSelection({}) })}>
            Assign
          </button>
        </div>
      )}
      <TableScroll label="Findings table">
        <table className="manager-table manager-table--stack" data-testid="findings-table">
          <caption className="visually-hidden">Findings, sorted by {filters.sort} {filters.order === 'desc' ? 'descending' : 'ascending'}</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sortable = SORTABLE.includes(header.column.id as FindingFilters['sort']);
                  const sorted = filters.sort === header.column.id ? (filters.order === 'desc' ? 'descending' : 'ascending') : undefined;
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted} className={sortable ? 'is-sortable' : header.column.id === 'select' ? 'is-select' : undefined}>
                      {sortable ? (
                        <button type="button" className="sort" onClick={header.column.getToggleSortingHandler()} data-testid={`sort-${header.column.id}`}>
                          <table.FlexRender header={header} /> {sorted === 'descending' ? '▼' : sorted === 'ascending' ? '▲' : ''}
                        </button>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="is-clickable" data-testid="finding-row" data-finding-id={row.id} onClick={() => navigate(`/review/${row.id}`)}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} data-label={cellLabel(cell.column.id, cell.column.columnDef.header)}>
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
      {rows.length === 0 && !query.isFetching && <p>No finding matches these filters.</p>}
      {query.isError && rows.length === 0 && <p role="alert">The findings could not be loaded: {query.error.message}</p>}
      {query.hasNextPage && (
        <button type="button" className="manager-button manager-button--plain" disabled={query.isFetchingNextPage} onClick={() => void query.fetchNextPage()} data-testid="show-more">
          Show more
        </button>
      )}
    </ManagerLayout>
  );
}
