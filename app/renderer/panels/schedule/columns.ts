// The schedule's columns, their sort keys, and sorting/filtering (pure, tested directly).

import type { CircuitResult, Link, Status } from '../../../../engine/index.js';
import { shownVerdict } from '../../sheet/labels.js';

export interface ScheduleRowData {
  link: Link;
  result: CircuitResult | undefined;
  /** Position in the file, the tie-breaker that keeps sorting stable. */
  index: number;
}

export type ColumnKey =
  | 'id' | 'name' | 'from' | 'to' | 'role' | 'cable' | 'length' | 'device' | 'rcd'
  | 'loop' | 'limit' | 'ia' | 'treq' | 'ratio' | 'maxLength' | 'status'
  | 'phases' | 'ib' | 'pf' | 'vdOwn' | 'vdTotal' | 'vdLimit' | 'vStatus' | 'iz' | 'izStatus'
  | 'rating' | 'breaking' | 'fault' | 'bStatus' | 'earthMin' | 'wStatus' | 'testLimit' | 'measured' | 'mStatus' | 'verdict';

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
  { key: 'length', label: 'Len.', unit: 'm', title: 'Route length (m)', group: 'input', firstDirection: 'desc', sortValue: (x) => x.link.cable.length },
  { key: 'device', label: 'Device', unit: 'In A', title: 'Protective device and its rated current In (A)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.device?.rating ?? null },
  { key: 'rcd', label: 'RCD', unit: 'mA', title: 'Residual-current device sensitivity (mA)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.rcd?.sensitivity ?? null },
  { key: 'loop', label: 'Zs / own', unit: 'Ω', title: 'Zs at the far end (source known), or own loop with the upstream loop below (source unknown)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.zs ?? r(x)?.own ?? null },
  { key: 'limit', label: 'Limit', unit: 'Ω', title: 'The loop impedance limit for this circuit (Ω)', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.limit ?? null },
  { key: 'ia', label: 'Ia', unit: 'A', title: 'Current Ia that disconnects the device in the required time (A)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.tripCurrent ?? null },
  { key: 'treq', label: 't req', unit: 's', title: 'Required disconnection time (s)', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.requiredTime ?? null },
  { key: 'maxLength', label: 'Max len.', unit: 'm', title: 'Maximum length of this link for its loop to stay within the limit (m)', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.maxLength ?? null },
  { key: 'ratio', label: 'Ratio', unit: '%', title: 'Loop impedance as a share of its limit, % (worst first by default)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.ratio ?? null },
  { key: 'status', label: 'Loop', title: 'The loop impedance check: fail, relies on RCD, pass, unchecked', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[r(x)!.status] : null) },
  { key: 'phases', label: 'Ph.', title: 'Phases, stated or derived (1 or 3)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.phases ?? null },
  { key: 'ib', label: 'Ib', unit: 'A', title: 'Design current Ib (A): the override typed here, else from the loads below', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.designCurrent ?? null },
  { key: 'pf', label: 'cos φ', title: 'Power factor used for the voltage drop', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.powerFactor ?? null },
  { key: 'vdOwn', label: 'Vd', unit: '% own', title: 'Voltage drop in this link (% of U0)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.voltageDrop ?? null },
  { key: 'vdTotal', label: 'Vd', unit: '% total', title: 'Voltage drop from the supply to the far end (% of U0)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.voltageDropTotal ?? null },
  { key: 'vdLimit', label: 'Vd', unit: '% limit', title: 'Voltage-drop limit at the point (% of U0); none for a link to a board', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.voltageDropLimit ?? null },
  { key: 'vStatus', label: 'Drop', title: 'The voltage-drop check: total drop against the limit', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[r(x)!.voltageStatus] : null) },
  { key: 'iz', label: 'Iz', unit: 'A', title: 'Cable capacity Iz (A): the value typed here, else the table times derating', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.capacity ?? null },
  { key: 'izStatus', label: 'Cap.', title: 'The capacity check Ib ≤ In ≤ Iz', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[r(x)!.capacityStatus] : null) },
  { key: 'rating', label: 'In', unit: 'A', title: 'Rated current In of the link\u2019s own device (A)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.device?.rating ?? null },
  { key: 'breaking', label: 'Icn', unit: 'kA', title: 'Breaking capacity of the device (kA)', group: 'input', firstDirection: 'asc', sortValue: (x) => x.link.device?.breaking ?? null },
  { key: 'fault', label: 'Imax', unit: 'kA', title: 'Maximum prospective fault current at the link\u2019s origin (kA)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.faultLevel ?? null },
  { key: 'bStatus', label: 'Break', title: 'The breaking-capacity check: the device breaks the fault level', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[r(x)!.breakingStatus] : null) },
  { key: 'earthMin', label: 'PE min', unit: 'mm²', title: 'Least protective-conductor area for the fault energy (adiabatic), mm²', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.earthMinArea ?? null },
  { key: 'wStatus', label: 'PE ok', title: 'The protective conductor\u2019s withstand check', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[r(x)!.withstandStatus] : null) },
  { key: 'testLimit', label: 'Test lim.', unit: 'Ω', title: 'Largest measured Zs that passes, at the measured temperature (else 20 °C), Ω', group: 'result', firstDirection: 'asc', sortValue: (x) => r(x)?.testLimit ?? null },
  { key: 'measured', label: 'Measured', unit: 'Ω', title: 'Measured Zs, with the corrected value below (Ω)', group: 'result', firstDirection: 'desc', sortValue: (x) => r(x)?.measured?.zs ?? null },
  { key: 'mStatus', label: 'Reading', title: 'The measured reading against its corrected limit', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x)?.measured ? STATUS_RANK[r(x)!.measured!.status] : null) },
  { key: 'verdict', label: 'Verdict', title: 'fail when any check fails; else relies on RCD; else pass; else unchecked', group: 'result', firstDirection: 'asc', sortValue: (x) => (r(x) ? STATUS_RANK[shownVerdict(r(x))] : null) },
];

export type ColumnSet = 'loop' | 'loads' | 'faults' | 'testing' | 'all';
export const COLUMN_SETS: readonly ColumnSet[] = ['loop', 'loads', 'faults', 'testing', 'all'];
export const COLUMN_SET_TITLE: Record<ColumnSet, string> = {
  loop: 'Earth-fault loop: impedance, limit, trip current, ratio',
  loads: 'Loads: design current, power factor, voltage drop, capacity',
  faults: 'Faults: fault level and breaking capacity, earth withstand',
  testing: 'Testing: test limit, measured reading and its result',
  all: 'Every column (scrolls sideways on a narrow screen)',
};

/**
 * The columns of each set, in order. Each set but 'all' holds what decides a circuit for its
 * question and fits a 1280 px wide window without scrolling sideways; the verdict is in every set.
 */
export const SET_COLUMNS: Record<ColumnSet, readonly ColumnKey[]> = {
  loop: ['id', 'name', 'cable', 'length', 'device', 'rcd', 'loop', 'limit', 'ratio', 'status', 'verdict'],
  loads: ['id', 'name', 'cable', 'rating', 'ib', 'vdTotal', 'vdLimit', 'vStatus', 'iz', 'izStatus', 'verdict'],
  faults: ['id', 'name', 'to', 'cable', 'device', 'breaking', 'fault', 'bStatus', 'earthMin', 'wStatus', 'verdict'],
  testing: ['id', 'name', 'to', 'device', 'testLimit', 'measured', 'mStatus', 'ratio', 'status', 'verdict'],
  all: [
    'id', 'name', 'from', 'to', 'role', 'phases', 'cable', 'length', 'device', 'rcd', 'loop', 'limit', 'ia', 'treq', 'maxLength',
    'ib', 'pf', 'vdOwn', 'vdTotal', 'vdLimit', 'vStatus', 'iz', 'izStatus', 'breaking', 'fault', 'bStatus', 'earthMin', 'wStatus',
    'testLimit', 'measured', 'mStatus', 'ratio', 'status', 'verdict',
  ],
};

/** Columns that stay in view at the right edge while a wide set scrolls sideways, right-most last. */
export const PINNED: readonly ColumnKey[] = ['ratio', 'status', 'verdict'];
/** Their widths (px), from which each pinned column's offset from the right edge follows. */
export const PINNED_WIDTH: Partial<Record<ColumnKey, number>> = { ratio: 50, status: 96, verdict: 96 };

/** The right offset (px) of each pinned column of a set that ends with pinned columns. */
export function pinnedOffsets(keys: readonly ColumnKey[]): Partial<Record<ColumnKey, number>> {
  const out: Partial<Record<ColumnKey, number>> = {};
  let right = 0;
  for (let i = keys.length - 1; i >= 0; i--) {
    const k = keys[i]!;
    if (!PINNED.includes(k)) break;
    out[k] = right;
    right += PINNED_WIDTH[k] ?? 0;
  }
  return out;
}

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

/**
 * The schedule filters by verdict: every check of a circuit, the loop included (as drawn on the
 * sheet: never milder than the loop's own status).
 */
export function verdictOf(row: ScheduleRowData): Status {
  return shownVerdict(row.result);
}

export function filterRows(rows: readonly ScheduleRowData[], filter: StatusFilter): ScheduleRowData[] {
  if (filter === 'all') return rows.slice();
  return rows.filter((row) => verdictOf(row) === filter);
}

export function countByVerdict(rows: readonly ScheduleRowData[]): Record<StatusFilter, number> {
  const counts: Record<StatusFilter, number> = { all: rows.length, fail: 0, rcd: 0, pass: 0, unchecked: 0 };
  for (const row of rows) counts[verdictOf(row)] += 1;
  return counts;
}
