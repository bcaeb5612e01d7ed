// How numbers and inputs are shown on the printout and in the CSV. One place, so the diagram,
// the schedule and the CSV agree, and a test can compare them with analyse().

import type { Cable, Link } from '../model/types.js';
import type { CircuitResult, Fix, LinkRole, Status } from '../analysis/results.js';

/** Ω to 3 decimals (0.576 Ω); an impedance of 10 Ω or more to 2. */
export function fmtOhm(v: number | null): string {
  if (v === null) return '—';
  if (!Number.isFinite(v)) return 'out of range'; // Ze or Zsrc worked out here from extreme values
  return Math.abs(v) >= 10 ? v.toFixed(2) : v.toFixed(3);
}

/** A to the nearest ampere from 100 A up, else to 0.1 A. */
export function fmtAmp(v: number | null): string {
  if (v === null) return '—';
  return Math.abs(v) >= 100 ? v.toFixed(0) : trimZeros(v.toFixed(1));
}

/** Seconds to 3 significant figures (0.4, 5, 0.1, 2.35). */
export function fmtSec(v: number | null): string {
  if (v === null) return '—';
  return trimZeros(v >= 100 ? v.toFixed(0) : v.toPrecision(3));
}

/** Metres to 0.1 m. */
export function fmtMetre(v: number | null): string {
  if (v === null) return '—';
  return trimZeros(v.toFixed(1));
}

/** The used share of the budget as a whole percentage (0.46958 → 47 %). */
export function fmtRatio(v: number | null): string {
  if (v === null) return '—';
  const pct = Math.round(v * 100);
  return Number.isFinite(pct) ? `${pct} %` : 'out of range'; // a ratio past 1.8e306
}

/** A plain number as the user wrote it, without float noise. */
export function fmtPlain(v: number): string {
  const shown = Number(v.toPrecision(10));
  return String(Number.isFinite(shown) ? shown : v); // near the largest double, 10 figures round up to Infinity
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}

/** `2.5/2.5 Cu`, `2×95/50 Al`, `16/6 Cu/Al` for a different earth material. */
export function fmtCable(cable: Cable): string {
  const n = cable.parallel ?? 1;
  const mat = cable.earthMaterial !== undefined && cable.earthMaterial !== cable.material
    ? `${cable.material}/${cable.earthMaterial}` : cable.material;
  return `${n > 1 ? `${n}×` : ''}${fmtPlain(cable.active)}/${fmtPlain(cable.earth)} ${mat}`;
}

/** `30 mA` for a 0.03 A RCD; empty when none. */
export function fmtRcd(link: Link): string {
  if (link.rcd === undefined) return '';
  const ma = link.rcd.sensitivity * 1000;
  return ma < 1000 ? `${fmtPlain(ma)} mA` : `${fmtPlain(link.rcd.sensitivity)} A`;
}

export const ROLE_SHORT: Record<LinkRole, string> = {
  'consumer-mains': 'mains',
  submain: 'submain',
  'final-subcircuit': 'final',
};

export const ROLE_LONG: Record<LinkRole, string> = {
  'consumer-mains': 'consumer mains',
  submain: 'submain',
  'final-subcircuit': 'final subcircuit',
};

export const STATUS_WORD: Record<Status, string> = {
  pass: 'PASS',
  fail: 'FAIL',
  rcd: 'RCD-RELIANT',
  unchecked: 'UNCHECKED',
};

/** The loop figure the circuit is judged by: Zs when the source is known, else the own loop. */
export function judgedLoop(c: CircuitResult): { label: 'Zs' | 'own'; value: number | null } {
  if (c.method === 'known-source') return { label: 'Zs', value: c.zs };
  return { label: 'own', value: c.own };
}

/** Failures first (fail, then rcd), then by ratio descending, unchecked last; ties in file order. */
export function scheduleOrder(circuits: readonly CircuitResult[]): CircuitResult[] {
  const rank: Record<Status, number> = { fail: 0, rcd: 1, pass: 2, unchecked: 3 };
  return circuits
    .map((c, index) => ({ c, index }))
    .sort((a, b) => {
      const r = rank[a.c.status] - rank[b.c.status];
      if (r !== 0) return r;
      if (a.c.status !== 'unchecked') {
        const ra = a.c.ratio ?? Infinity;
        const rb = b.c.ratio ?? Infinity;
        if (ra !== rb) return rb - ra;
      }
      return a.index - b.index;
    })
    .map((x) => x.c);
}

/** A percentage of U0 (a voltage drop) to 2 decimals below 10 %, else 1: 3.21, 12.5. */
export function fmtDrop(v: number | null): string {
  if (v === null) return '—';
  return Math.abs(v) >= 10 ? v.toFixed(1) : v.toFixed(2);
}

/** A prospective fault current in kA to 2 decimals below 10 kA, else 1: 6.21, 12.4. */
export function fmtKa(amps: number | null): string {
  if (amps === null) return '—';
  const ka = amps / 1000;
  return Math.abs(ka) >= 10 ? ka.toFixed(1) : ka.toFixed(2);
}

/** A cross-section, mm², to 2 decimals (a computed minimum, not a standard size). */
export function fmtArea(v: number | null): string {
  if (v === null) return '—';
  return v >= 100 ? v.toFixed(0) : v.toFixed(2);
}

/** A power factor to 2 decimals. */
export function fmtPf(v: number | null): string {
  if (v === null) return '—';
  return v.toFixed(2);
}

/** The word of a check's status (voltage, capacity, breaking, withstand, measured), as the loop's. */
export function checkWord(s: Status | 'pass' | 'fail' | 'unchecked'): string {
  return STATUS_WORD[s];
}

/** The checks beside the loop, by the name a designer uses for each. */
export const CHECK_NAME = {
  voltage: 'voltage drop',
  capacity: 'capacity (Ib ≤ In ≤ Iz)',
  breaking: 'breaking capacity',
  withstand: 'earth withstand',
  measured: 'measured reading',
} as const;

/** The checks other than the loop that fail (or, for the reading, rely on an RCD), named in words. */
export function otherFailures(c: CircuitResult, short = false): string[] {
  const out: string[] = [];
  if (c.voltageStatus === 'fail') out.push(short ? 'drop' : 'voltage drop');
  if (c.capacityStatus === 'fail') out.push('capacity');
  if (c.breakingStatus === 'fail') out.push(short ? 'breaking' : 'breaking capacity');
  if (c.withstandStatus === 'fail') out.push(short ? 'withstand' : 'earth withstand');
  if (c.measured !== null && (c.measured.status === 'fail' || c.measured.status === 'rcd')) out.push(short ? 'reading' : 'measured reading');
  return out;
}

/**
 * The verdict with the checks that decide it, when it says more than the loop status:
 * `FAIL: voltage drop, capacity`, `RCD-RELIANT: measured reading`; null when the loop status says
 * it all. `short` words the checks briefly for a diagram label (`FAIL: drop, breaking`).
 */
export function verdictNote(c: CircuitResult, short = false): string | null {
  const others = otherFailures(c, short);
  if (c.verdict === c.status && others.length === 0) return null;
  // Short (a diagram label): the loop's status is on the line above, so only the other checks.
  const loop = short ? [] : c.status === 'fail' ? ['loop'] : c.status === 'rcd' ? ['loop (relies on the RCD)'] : [];
  const reasons = [...loop, ...others];
  return reasons.length > 0 ? `${STATUS_WORD[c.verdict]}: ${reasons.join(', ')}` : STATUS_WORD[c.verdict];
}

/** A fix in words: `shorten to 45.2 m or less`, `cable 4/2.5 mm²`, `device C16`, `add a 30 mA RCD (then relies on it)`. */
export function fmtFix(fix: Fix): string {
  switch (fix.kind) {
    case 'length':
      return `shorten to ${fmtMetre(fix.maxLength)} m or less`;
    case 'size':
      return `cable ${fmtPlain(fix.active)}/${fmtPlain(fix.earth)} mm²`;
    case 'device':
      return `device ${fix.curve}${fmtPlain(fix.rating)}`;
    case 'rcd':
      return `add a ${fmtPlain(fix.sensitivity * 1000)} mA RCD (the circuit then relies on the RCD)`;
  }
}

/** Every fix of a link in words, `; ` between them; empty when none. */
export function fmtFixes(c: CircuitResult): string {
  return c.fixes.map(fmtFix).join('; ');
}

/** Failures first by verdict (fail, then rcd), then the loop order of scheduleOrder within each verdict. */
export function verdictOrder(circuits: readonly CircuitResult[]): CircuitResult[] {
  const rank: Record<Status, number> = { fail: 0, rcd: 1, pass: 2, unchecked: 3 };
  const loopOrder = scheduleOrder(circuits);
  const pos = new Map(loopOrder.map((c, i) => [c, i] as const));
  return [...circuits].sort((a, b) => rank[a.verdict] - rank[b.verdict] || (pos.get(a) ?? 0) - (pos.get(b) ?? 0));
}
