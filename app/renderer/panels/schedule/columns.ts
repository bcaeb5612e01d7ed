// The schedule's columns, their sort keys, and sorting/filtering (pure, tested directly).

import type { CircuitResult, Link, Status } from '../../../../engine/index.js';

export interface ScheduleRowData {
  link: Link;
  result: CircuitResult | undefined;
  /** Position in the file, the tie-breaker that keeps sorting stable. */
  index: number;
}

export type ColumnKey =
  | 'id' | 'name' | 'from' | 'to' | 'role' | 'cable' | 'length' | 'device' | 'rcd'
  | 'loop' | 'limit' | 'ia' | 'treq' | 'ratio' | 'maxLength' | 'status';

export interface Column {
  key: ColumnKey;
  label: string;
  /** The unit of every value in the column, shown under the label (cells carry bare numbers). */
  unit?: string;
  title: string;
  /** Input columns come from the job; result columns from the engine. */
  group: 'input' | 'result';
  sortValue(row: ScheduleRowData): number | string | null;
  /** The direction of the first click on the head. */
  firstDirection: SortDirection;
}

export type SortDirection = 'asc' | 'desc';
export interface SortState {
  key: ColumnKey;
  direction: SortDirection;
}

export const DEFAULT_SORT: SortState = { key: 'ratio', direction: 'desc' };

/** fail first, then rcd, pass, unchecked (ascending = most severe first). */
const STATUS_RANK: Record<Status, number> = { fail: 0, rcd: 1, pass: 2, unchecked: 3 };

const r = (row: ScheduleRowData) => row.result;

export const COLUMNS: readonly Column[] = [
  { key: 'id', label: 'Id', title: 'Link id', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.id },
  { key: 'name', label: 'Name', title: 'Circuit name', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.name ?? null },
  { key: 'from', label: 'From', title: 'Node at the origin (id)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.from },
  { key: 'to', label: 'To', title: 'Node at the far end (id)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.to },
  { key: 'role', label: 'Role', title: 'Consumer mains, submain or final subcircuit', group: 'input', firstDirection: 'asc', sortValue: (x) => r(x)?.role ?? null },
  { key: 'cable', label: 'Cable', unit: 'mm²', title: 'Active / earth conductor size (mm²) and material', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.cable.active },
  { key: 'length', label: 'Length', unit: 'm', title: 'Route length (m)', group: 'input', firstDirection: 'desc', sortValue: (x) => x.link.cable.length },
  { key: 'device', label: 'Device', unit: 'In A', title: 'Protective device and its rated current In (A)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.device?.rating ?? null },
  { key: 'rcd', label: 'RCD', unit: 'mA', title: 'Residual-current device sensitivity (mA)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.rcd?.sensitivity ?? null },
  { key: 'loop', label: 'Zs / own', unit: 'Ω', title: 'Zs at the far end (source known), or own loop with the upstream loop below (source unknown)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.zs ?? r(x)?.own ?? null },
  { key: 'limit', label: 'Limit', unit: 'Ω', title: 'The loop impedance limit for this circuit (Ω)', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.limit ?? null },
  { key: 'ia', label: 'Ia', unit: 'A', title: 'Current Ia that disconnects the device in the required time (A)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.tripCurrent ?? null },
  { key: 'treq', label: 't req', unit: 's', title: 'Required disconnection time (s)', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.requiredTime ?? null },
  { key: 'maxLength', label: 'Max len.', unit: 'm', title: 'Maximum length of this link for its loop to stay within the limit (m)', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.maxLength ?? null },
  { key: 'ratio', label: 'Ratio', unit: '%', title: 'Loop impedance as a share of its limit, % (worst first by default)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.ratio ?? null },
  { key: 'status', label: 'Status', title: 'fail, relies on RCD, pass, unchecked', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[r(x)!.status] : null) },
];

export const COLUMN_BY_KEY: Record<ColumnKey, Column> = Object.fromEntries(COLUMNS.map((c) => [c.key, c])) as Record<ColumnKey, Column>;

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

function compareValues(a: number | string, b: number | string): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return collator.compare(String(a), String(b));
}

/** Sorted copy: by the column in the given direction, nulls last either way, file order on ties. */
export function sortRows(rows: readonly ScheduleRowData[], sort: SortState): ScheduleRowData[] {
  const column = COLUMN_BY_KEY[sort.key];
  const sign = sort.direction === 'asc' ? 1 : -1;
  const keyed = rows.map((row) => ({ row, v: column.sortValue(row) }));
  keyed.sort((a, b) => {
    if (a.v === null && b.v === null) return a.row.index - b.row.index;
    if (a.v === null) return 1;
    if (b.v === null) return -1;
    return sign * compareValues(a.v, b.v) || a.row.index - b.row.index;
  });
  return keyed.map((k) => k.row);
}

/** The next sort after a click on a column head: the same column flips, another starts fresh. */
export function nextSort(current: SortState, key: ColumnKey): SortState {
  if (current.key === key) return { key, direction: current.direction === 'asc' ? 'desc' : 'asc' };
  return { key, direction: COLUMN_BY_KEY[key].firstDirection };
}

export type StatusFilter = 'all' | Status;
export const STATUS_FILTERS: readonly StatusFilter[] = ['all', 'fail', 'rcd', 'pass', 'unchecked'];

export function filterRows(rows: readonly ScheduleRowData[], filter: StatusFilter): ScheduleRowData[] {
  if (filter === 'all') return rows.slice();
  return rows.filter((row) => (row.result?.status ?? 'unchecked') === filter);
}

export function countByStatus(rows: readonly ScheduleRowData[]): Record<StatusFilter, number> {
  const counts: Record<StatusFilter, number> = { all: rows.length, fail: 0, rcd: 0, pass: 0, unchecked: 0 };
  for (const row of rows) counts[row.result?.status ?? 'unchecked'] += 1;
  return counts;
}
