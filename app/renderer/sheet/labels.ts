// Text on the drawing: device mark, cable, result and status. Status is always given by a
// symbol and a word as well as a colour.
import type { CircuitResult, Link, Source, Status } from '../../../engine/index.js';

export const STATUS_SYMBOL: Record<Status, string> = { pass: '✓', fail: '✗', rcd: '⚠', unchecked: '○' };
export const STATUS_WORD: Record<Status, string> = { pass: 'pass', fail: 'FAIL', rcd: 'RCD-reliant', unchecked: 'unchecked' };

/** Ohms for display: two decimals below 10 Ω, three significant figures above. */
export function ohms(v: number): string {
  return v < 10 ? v.toFixed(2) : v.toPrecision(3);
}

export function num(v: number): string {
  return Number.isInteger(v) ? String(v) : String(Number(v.toFixed(2)));
}

export function rcdMark(link: Link): string | null {
  if (!link.rcd) return null;
  const mA = link.rcd.sensitivity * 1000;
  return `RCD ${num(mA)} mA`;
}

export function deviceLine(link: Link, result: CircuitResult | undefined): string {
  const parts: string[] = [];
  if (link.device) parts.push(result?.device ?? link.device.label ?? `${link.device.rating} A`);
  const rcd = rcdMark(link);
  if (rcd) parts.push(rcd);
  if (parts.length > 0) return parts.join(' · ');
  if (result?.protectedBy && result.protectedBy !== link.id) return `via ${result.protectedBy}`;
  return 'no device';
}

export function cableLine(link: Link): string {
  const c = link.cable;
  const sets = c.parallel && c.parallel > 1 ? `${c.parallel}× ` : '';
  const earthMat = c.earthMaterial && c.earthMaterial !== c.material ? ` ${c.earthMaterial}` : '';
  return `${sets}${num(c.active)}/${num(c.earth)}${earthMat} ${c.material}, ${num(c.length)} m`;
}

export function resultLine(r: CircuitResult | undefined): string {
  if (!r) return '';
  const pct = r.ratio !== null ? `, ${Math.round(r.ratio * 100)} %` : '';
  if (r.method === 'known-source' && r.zs !== null) {
    return r.limit !== null ? `Zs ${ohms(r.zs)} / ${ohms(r.limit)} Ω${pct}` : `Zs ${ohms(r.zs)} Ω`;
  }
  if (r.method === 'unknown-source' && r.own !== null) {
    return r.limit !== null ? `own ${ohms(r.own)} / ${ohms(r.limit)} Ω${pct}` : `own ${ohms(r.own)} Ω`;
  }
  return r.method === null ? 'no supply' : '';
}

export function statusText(status: Status): string {
  return `${STATUS_SYMBOL[status]} ${STATUS_WORD[status]}`;
}

export function sourceLine(source: Source): string {
  switch (source.type) {
    case 'unknown':
      return 'Ze unknown (80 % rule)';
    case 'impedance':
      return `Ze ${ohms(Math.hypot(source.r, source.x))} Ω`;
    case 'fault-current': {
      const kA = source.current / 1000;
      return `Ipf ${num(kA)} kA${source.xr !== undefined ? `, X/R ${num(source.xr)}` : ''}`;
    }
  }
}

export const USE_LABEL: Record<string, string> = {
  'socket-outlets': 'socket-outlets',
  lighting: 'lighting',
  'fixed-equipment': 'fixed equipment',
  motor: 'motor',
  other: 'other',
};

// ---- Loads, drops, faults and readings (format version 2) ----

/** The checks that make up a verdict, in the order they are named. */
export const CHECKS = [
  { key: 'loop', word: 'loop impedance', short: 'loop' },
  { key: 'voltage', word: 'voltage drop', short: 'drop' },
  { key: 'capacity', word: 'cable capacity', short: 'capacity' },
  { key: 'breaking', word: 'breaking capacity', short: 'breaking' },
  { key: 'withstand', word: 'earth withstand', short: 'earth' },
  { key: 'measured', word: 'measured reading', short: 'reading' },
] as const;
export type CheckKey = (typeof CHECKS)[number]['key'];

/** The status of each check of one circuit (the measured one 'unchecked' without a reading). */
export function checkStatuses(r: CircuitResult): Record<CheckKey, Status> {
  return {
    loop: r.status,
    voltage: r.voltageStatus,
    capacity: r.capacityStatus,
    breaking: r.breakingStatus,
    withstand: r.withstandStatus,
    measured: r.measured?.status ?? 'unchecked',
  };
}

/** The words of the checks that fail, in the order of CHECKS (empty when none fails). */
export function failingChecks(r: CircuitResult, short = false): string[] {
  const s = checkStatuses(r);
  return CHECKS.filter((c) => s[c.key] === 'fail').map((c) => (short ? c.short : c.word));
}

const SEVERITY: Record<Status, number> = { fail: 3, rcd: 2, pass: 1, unchecked: 0 };

/**
 * The status a circuit is drawn with: its verdict, or its loop status when that is more severe
 * (by the contract the verdict is never milder than the loop; this keeps a loop failure flagged
 * whatever the verdict says).
 */
export function shownVerdict(r: CircuitResult | undefined): Status {
  if (!r) return 'unchecked';
  return SEVERITY[r.status] > SEVERITY[r.verdict] ? r.status : r.verdict;
}

/**
 * The verdict line: symbol and word, and for a failure which checks fail. A circuit whose design
 * passes but whose measured reading fails says so.
 */
export function verdictText(r: CircuitResult | undefined, short = false): string {
  const shown = shownVerdict(r);
  const head = statusText(shown);
  if (!r || shown !== 'fail') return head;
  const failing = failingChecks(r, short);
  const s = checkStatuses(r);
  if (s.measured === 'fail' && failing.length === 1) return short ? `${head}: reading` : `${head}: design passes, reading fails`;
  return failing.length > 0 ? `${head}: ${failing.join(', ')}` : head;
}

/** A percentage of U0 for a label: one decimal, trailing zero dropped. */
function pct(v: number): string {
  return String(Number(v.toFixed(v < 10 ? 1 : 0)));
}

function amp(v: number): string {
  return v >= 100 ? String(Math.round(v)) : String(Number(v.toFixed(1)));
}

/** "Ib 16 A · Vd 3.1 / 5 %" (total drop against its limit where one applies); '' without Ib. */
export function loadLine(r: CircuitResult | undefined): string {
  if (!r || r.designCurrent === null) return '';
  const ib = `Ib ${amp(r.designCurrent)} A`;
  if (r.voltageDropTotal === null) return ib;
  const limit = r.voltageDropLimit !== null ? ` / ${pct(r.voltageDropLimit)}` : '';
  return `${ib} · Vd ${pct(r.voltageDropTotal)}${limit} %`;
}

/** "meas. 0.62 Ω → 0.74 Ω, ✓ 81 %": the reading, corrected, and its result; '' without one. */
export function measuredLine(r: CircuitResult | undefined): string {
  const m = r?.measured;
  if (!m) return '';
  const ratio = m.ratio !== null ? ` ${Math.round(m.ratio * 100)} %` : '';
  return `meas. ${ohms(m.zs)} → ${ohms(m.corrected)} Ω, ${STATUS_SYMBOL[m.status]} ${STATUS_WORD[m.status]}${ratio}`;
}

/** "Imax 6.2 kA": the largest fault current at a node; '' when unknown. */
export function faultLevelLine(current: number | null | undefined): string {
  if (current === null || current === undefined || !Number.isFinite(current)) return '';
  return current >= 1000 ? `Imax ${num(current / 1000)} kA` : `Imax ${Math.round(current)} A`;
}

/**
 * A supply's headroom: for a known source the largest Ze the design tolerates, for an unknown
 * one the fault current to ask the distributor for.
 */
export function headroomLine(source: Source, maxZe: number | null | undefined, minFaultCurrent: number | null | undefined): string {
  if (source.type === 'unknown') {
    if (minFaultCurrent !== null && minFaultCurrent !== undefined && Number.isFinite(minFaultCurrent)) return `need Ipf ≥ ${Math.ceil(minFaultCurrent)} A`;
    return maxZe !== null && maxZe !== undefined ? `need Ze ≤ ${ohms(maxZe)} Ω` : '';
  }
  return maxZe !== null && maxZe !== undefined ? `Ze max ${ohms(maxZe)} Ω` : '';
}

export type LabelLineKey = 'device' | 'cable' | 'result' | 'load' | 'measured' | 'verdict';
export interface LabelLine {
  key: LabelLineKey;
  text: string;
}

/** Every line a link label can show, in drawing order (empty lines left out); `short` words for a zoomed-out view. */
export function labelLines(link: Link, r: CircuitResult | undefined, short = false): LabelLine[] {
  const lines: LabelLine[] = [
    { key: 'device', text: deviceLine(link, r) },
    { key: 'cable', text: cableLine(link) },
    { key: 'result', text: resultLine(r) },
    { key: 'load', text: loadLine(r) },
    { key: 'measured', text: measuredLine(r) },
    { key: 'verdict', text: verdictText(r, short) },
  ];
  return lines.filter((l) => l.text !== '');
}

/**
 * Which lines to keep when only `count` fit: the verdict always, then the line of a failing check,
 * then the loop result, load, reading, device and cable. Kept lines stay in drawing order.
 */
export function pickLines(lines: readonly LabelLine[], count: number, r: CircuitResult | undefined): LabelLine[] {
  if (count >= lines.length) return lines.slice();
  const s = r ? checkStatuses(r) : null;
  const rank = (l: LabelLine): number => {
    if (l.key === 'verdict') return 0;
    const failing =
      (l.key === 'result' && s?.loop === 'fail') ||
      (l.key === 'load' && (s?.voltage === 'fail' || s?.capacity === 'fail')) ||
      (l.key === 'measured' && s?.measured === 'fail');
    if (failing) return 1;
    return { result: 2, load: 3, measured: 4, device: 5, cable: 6 }[l.key];
  };
  const keep = new Set([...lines].sort((a, b) => rank(a) - rank(b)).slice(0, Math.max(1, count)).map((l) => l.key));
  return lines.filter((l) => keep.has(l.key));
}

/** The smallest type a label is drawn in, in screen pixels, whatever the zoom. */
export const MIN_LABEL_PX = 9;
/** The label's type at zoom 1 (flow px = screen px); zoomed out, the most it takes on screen. */
export const LABEL_FONT = 11;
export const LABEL_LINE = 1.3;
/** Border and padding above and below the lines (flow px). */
export const LABEL_PAD = 6;

export interface LabelFit {
  /** Lines to draw. */
  count: number;
  /** Type size in flow px. */
  font: number;
}

/**
 * How many of `wanted` lines fit in `room` flow px at `zoom`, and at what size. The type is never
 * smaller than MIN_LABEL_PX on screen; zoomed out it is at most LABEL_FONT on screen (so larger in
 * flow px), zoomed in at most LABEL_FONT flow px. Zoomed out: fewer lines rather than smaller type.
 * Never taller than the room (no label runs under a part); when not even one line fits at a
 * readable size, one line as large as the room allows.
 */
export function fitLabel(wanted: number, room: number, zoom: number): LabelFit {
  const z = zoom > 0 ? zoom : 1;
  const smallest = MIN_LABEL_PX / z;
  const largest = Math.max(LABEL_FONT, LABEL_FONT / z);
  for (let n = Math.max(1, wanted); n >= 1; n--) {
    const font = Math.min(largest, (room - LABEL_PAD) / (n * LABEL_LINE));
    if (font >= smallest - 1e-9) return { count: n, font };
  }
  return { count: 1, font: Math.max(1, Math.min(largest, (room - LABEL_PAD) / LABEL_LINE)) };
}

/** Average width of a label character, as a share of the type size (system sans, bold; common practice). */
export const CHAR_WIDTH = 0.68;

export interface VerdictFit {
  /** Whether the link id leads the line. */
  withId: boolean;
  text: string;
  /** Type size (flow px), reduced only when not even the status word fits the width. */
  font: number;
}

/**
 * The verdict line for a label `width` flow px wide at type `font`: the status symbol and word
 * always whole; then, as room allows, which checks fail and the link id (left out first when
 * the device line, which carries the id, is drawn).
 */
export function fitVerdict(id: string, r: CircuitResult | undefined, font: number, width: number, idElsewhere: boolean): VerdictFit {
  const chars = width / (CHAR_WIDTH * font);
  const long = verdictText(r);
  const short = verdictText(r, true);
  const head = statusText(shownVerdict(r));
  const tries: Array<{ withId: boolean; text: string }> = idElsewhere
    ? [{ withId: false, text: long }, { withId: false, text: short }, { withId: false, text: head }]
    : [
      { withId: true, text: long }, { withId: true, text: short }, { withId: false, text: short },
      { withId: true, text: head }, { withId: false, text: head },
    ];
  for (const t of tries) {
    const length = (t.withId ? id.length + 1 : 0) + t.text.length;
    if (length <= chars) return { ...t, font };
  }
  // Not even the status word fits at this size: smaller type rather than a cut word.
  return { withId: false, text: head, font: Math.min(font, width / (CHAR_WIDTH * head.length)) };
}
