import { type ColumnDef, createColumnHelper, columnVisibilityFeature, rowSelectionFeature, rowSortingFeature, tableFeatures } from '@tanstack/react-table';
import { FINDING_STATE_SHORT, type FindingListItem, type Person, type Scaffold } from '@plummet/shared';
import { formatDay } from '../../../lib/format-date';
import { Link } from 'react-router-dom';
import { formatHeight } from '../manager-units';
import type { Units } from '../../../lib/units';

export const findingsTableFeatures = tableFeatures({ rowSortingFeature, columnVisibilityFeature, rowSelectionFeature });
const column = createColumnHelper<typeof findingsTableFeatures, FindingListItem>();

export interface ColumnContext {
  units: Units;
  scaffolds: Map<string, Scaffold>;
  members: Map<string, Person>;
}


/** Column ids that the server can sort by are named as the list route's sort keys. */
export function findingsColumns(ctx: ColumnContext): ColumnDef<typeof findingsTableFeatures, FindingListItem>[] {
  const columns = [
    column.display({
      id: 'select',
      enableHiding: false,
      header: ({ table }) => (
        <input type="checkbox" aria-label="Select every finding shown" checked={table.getIsAllRowsSelected()} onChange={table.getToggleAllRowsSelectedHandler()} />
      ),
      cell: ({ row }) => (
        <input type="checkbox" aria-label={`Select ${row.original.itemName}`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} onClick={(e) => e.stopPropagation()} />
      ),
    }),
    // A link as well as a clickable row: reachable by keyboard and announced as the way in.
    column.accessor('itemName', {
      id: 'item',
      header: 'Item',
      enableSorting: false,
      enableHiding: false,
      cell: (c) => (
        <Link to={`/review/${c.row.original.id}`} onClick={(e) => e.stopPropagation()}>
          {c.getValue()}
        </Link>
      ),
    }),
    column.accessor('riskScore', { id: 'riskScore', header: 'Risk', cell: (c) => `${c.row.original.riskBand} ${c.getValue()}` }),
    column.accessor('state', { id: 'state', header: 'State', enableSorting: false, cell: (c) => FINDING_STATE_SHORT[c.getValue()] }),
    column.accessor((f) => ctx.scaffolds.get(f.scaffoldId)?.reference ?? '', { id: 'scaffold', header: 'Scaffold', enableSorting: false }),
    column.accessor((f) => `${f.elevation}, lift ${f.lift}, bay ${f.bay}`, { id: 'position', header: 'Position', enableSorting: false }),
    column.accessor('heightM', { id: 'heightM', header: 'Height', cell: (c) => formatHeight(c.getValue(), ctx.units) }),
    column.accessor((f) => (f.assigneeId ? (ctx.members.get(f.assigneeId)?.name ?? 'Someone') : 'Nobody'), { id: 'assignee', header: 'Assignee', enableSorting: false }),
    column.accessor('dueAt', { id: 'dueAt', header: 'Due', cell: (c) => `${formatDay(c.getValue())}${c.row.original.overdue ? ' (overdue)' : ''}` }),
    column.accessor('createdAt', { id: 'createdAt', header: 'Raised', cell: (c) => formatDay(c.getValue()) }),
    column.accessor('notePreview', { id: 'notes', header: 'Note', enableSorting: false }),
  ];
  // The helper types each column by its value; the table takes them as one list.
  return columns as unknown as ColumnDef<typeof findingsTableFeatures, FindingListItem>[];
}
