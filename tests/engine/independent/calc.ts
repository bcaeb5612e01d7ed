// An independent calculator of the contract (/work/shared/method.md and method-depth.md),
// written from those documents alone, to cross-check the engine. It takes a parsed job and
// returns, per link, the results fields; it shares no code with engine/analysis (only the
// job's types). Plain and slow on purpose: every sum is recomputed along its path.
//
// Constants are the documents' own; each carries the source the document gives:
// - ρ at fault, au-nz: Cu 0.0225, Al 0.036 (AS/NZS 3000:2018 B5.2.2); iec: ρ20·(1 + α·50)
//   (IEC 60028 / IEC 60889, from memory).
// - breaker multiples au-nz 4 / 7.5 / 12.5 (AS/NZS 3000:2018 Table B5.1 note); iec 5 / 10 / 20
//   (IEC 60898-1, from memory).
// - x = 0.08 mΩ/m (common practice, from memory); cmax 1.10 (IEC 60909-0:2016 Table 1, from
//   memory); ρ20 for fault levels Cu 0.0185, Al 0.0294 (IEC 60909-0, from memory); ρv Cu 0.0225,
//   Al 0.036 (IEC 60364-5-52 Annex G); k table (IEC 60364-5-54 Tables A.54.2 / A.54.3, from
//   memory); capacity table (IEC 60364-5-52:2009 Tables B.52.4 / B.52.5, method C, from memory).

import type { Curve, Device, Job, JobNode, Link, Material, Phases, PointNode, SupplyNode } from '../../../engine/index.js';

export type St = 'pass' | 'fail' | 'rcd' | 'unchecked';
export type Ck = 'pass' | 'fail' | 'unchecked';
export type XFix =
  | { kind: 'length'; maxLength: number }
  | { kind: 'size'; active: number; earth: number }
  | { kind: 'device'; curve: Curve; rating: number }
  | { kind: 'rcd'; sensitivity: number };

export interface XCircuit {
  link: string;
  role: 'consumer-mains' | 'submain' | 'final-subcircuit';
  method: 'known-source' | 'unknown-source' | null;
  protectedBy: string | null;
  tripCurrent: number | null;
  requiredTime: number | null;
  zs: number | null;
  own: number | null;
  upstream: number | null;
  limit: number | null;
  faultCurrent: number | null;
  clearingTime: number | null;
  ratio: number | null;
  maxLength: number | null;
  status: St;
  phases: Phases;
  designCurrent: number | null;
  powerFactor: number | null;
  voltageDrop: number | null;
  voltageDropTotal: number | null;
  voltageDropLimit: number | null;
  voltageStatus: Ck;
  capacity: number | null;
  capacityStatus: Ck;
  faultLevel: number | null;
  breakingStatus: Ck;
  earthMinArea: number | null;
  withstandStatus: Ck;
  testLimit: number | null;
  measured: { zs: number; corrected: number; ratio: number | null; status: St } | null;
  fixes: XFix[];
  verdict: St;
}

export interface XSupply {
  node: string;
  phases: Phases;
  faultLevel: number | null;
  maxZe: number | null;
  minFaultCurrent: number | null;
}

type Counts4 = { pass: number; fail: number; rcd: number; unchecked: number };
type Counts3 = { pass: number; fail: number; unchecked: number };

export interface XResults {
  circuits: XCircuit[];
  worst: { link: string; ratio: number; path: string[] } | null;
  supplies: XSupply[];
  summary: Counts4 & {
    verdict: Counts4;
    checks: { voltage: Counts3; capacity: Counts3; breaking: Counts3; withstand: Counts3; measured: Counts4 };
  };
}

// ---------- complex numbers, as pairs ----------
export interface Cx {
  re: number;
  im: number;
}
const cx = (re: number, im: number): Cx => ({ re, im });
const add = (a: Cx, b: Cx): Cx => cx(a.re + b.re, a.im + b.im);
const scale = (a: Cx, k: number): Cx => cx(a.re * k, a.im * k);
const mag = (a: Cx): number => Math.hypot(a.re, a.im);
const ZERO = cx(0, 0);

/** The contract's edge rule: a ≤ b within a relative 1e-9 of the limit b. */
export const atMost = (a: number, b: number): boolean => a <= b + 1e-9 * Math.abs(b);

export const STANDARD = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630];
export const RATINGS = [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125];
const CURVES: Curve[] = ['B', 'C', 'D'];

// method-depth.md §4, the iec table: [mm², Cu PVC 2, Cu PVC 3, Cu XLPE 2, Cu XLPE 3, Al PVC 2, Al PVC 3, Al XLPE 2, Al XLPE 3]
const IZ: Array<Array<number | null>> = [
  [1.5, 19.5, 17.5, 24, 22, null, null, null, null],
  [2.5, 27, 24, 33, 30, 21, 18.5, 26, 23],
  [4, 36, 32, 45, 40, 28, 25, 35, 31],
  [6, 46, 41, 58, 52, 36, 32, 45, 40],
  [10, 63, 57, 80, 71, 49, 44, 62, 54],
  [16, 85, 76, 107, 96, 66, 59, 84, 73],
  [25, 112, 96, 138, 119, 83, 73, 101, 89],
  [35, 138, 119, 171, 147, 103, 90, 126, 111],
  [50, 168, 144, 209, 179, 125, 110, 154, 135],
  [70, 213, 184, 269, 229, 160, 140, 198, 173],
  [95, 258, 223, 328, 278, 195, 170, 241, 210],
  [120, 299, 259, 382, 322, 226, 197, 280, 244],
  [150, 344, 299, 441, 371, 261, 227, 324, 282],
  [185, 392, 341, 506, 424, 298, 259, 371, 322],
  [240, 461, 403, 599, 500, 352, 305, 439, 380],
  [300, 530, 464, 693, 576, 406, 351, 508, 439],
];

export function tableIz(material: Material, insulation: 'pvc' | 'xlpe', loaded: 2 | 3, size: number): number | null {
  const row = IZ.find((r) => r[0] === size);
  if (!row) return null;
  const col = 1 + (material === 'Al' ? 4 : 0) + (insulation === 'xlpe' ? 2 : 0) + (loaded === 3 ? 1 : 0);
  return row[col] ?? null;
}

// method-depth.md §6
export function kValue(earth: Material, insulation: 'pvc' | 'xlpe', inCable: boolean): number {
  if (earth === 'Cu') return inCable ? (insulation === 'pvc' ? 115 : 143) : insulation === 'pvc' ? 143 : 176;
  return inCable ? (insulation === 'pvc' ? 76 : 94) : insulation === 'pvc' ? 95 : 116;
}

const RHO20: Record<Material, number> = { Cu: 1 / 58, Al: 0.028264 };
const ALPHA: Record<Material, number> = { Cu: 0.00393, Al: 0.00403 };

export interface Basis {
  basis: 'au-nz' | 'iec';
  U0: number;
  c: number;
  s: number;
  x: number;
  rho: Record<Material, number>;
  mult: Record<Curve, number>;
  rhoV: Record<Material, number>;
  cmax: number;
  rhoSc: Record<Material, number>;
  vdLimit: number | undefined;
  measuredRule: 'temperature' | 'fixed-factor';
  measuredFactor: number;
}

export function basisOf(job: Job): Basis {
  const r = job.rules;
  const iec = r.basis === 'iec';
  const rhoDefault: Record<Material, number> = iec
    ? { Cu: RHO20.Cu * (1 + ALPHA.Cu * 50), Al: RHO20.Al * (1 + ALPHA.Al * 50) }
    : { Cu: 0.0225, Al: 0.036 };
  const multDefault: Record<Curve, number> = iec ? { B: 5, C: 10, D: 20 } : { B: 4, C: 7.5, D: 12.5 };
  return {
    basis: r.basis,
    U0: r.voltage ?? 230,
    c: r.voltageFactor ?? 1,
    s: r.unknownSourceShare ?? 0.8,
    x: r.reactance ?? 0.00008,
    rho: { ...rhoDefault, ...(r.resistivity ?? {}) } as Record<Material, number>,
    mult: { ...multDefault, ...(r.multiples ?? {}) } as Record<Curve, number>,
    rhoV: { Cu: 0.0225, Al: 0.036, ...(r.voltageDropResistivity ?? {}) } as Record<Material, number>,
    cmax: r.maxVoltageFactor ?? 1.1,
    rhoSc: { Cu: 0.0185, Al: 0.0294, ...(r.shortCircuitResistivity ?? {}) } as Record<Material, number>,
    vdLimit: r.voltageDropLimit,
    measuredRule: r.measuredRule ?? 'temperature',
    measuredFactor: r.measuredFactor ?? 0.8,
  };
}

/** Earth-fault loop impedance of one link (method.md): active out, earth back. */
export function loopZ(b: Basis, l: Link, cab = l.cable): Cx {
  const n = cab.parallel ?? 1;
  const x = cab.reactance ?? b.x;
  const em = cab.earthMaterial ?? cab.material;
  const R = (b.rho[cab.material] * cab.length / cab.active + b.rho[em] * cab.length / cab.earth) / n;
  return cx(R, (2 * x * cab.length) / n);
}

/** Ia (method.md). null where a curve does not reach t_req. */
export function tripCurrentOf(b: Basis, d: Device, treq: number): number | null {
  switch (d.type) {
    case 'mcb':
      return b.mult[d.curve] * d.rating;
    case 'adjustable':
      return d.instantaneous * (1 + (d.tolerance ?? 0.2));
    case 'fixed':
      return d.tripCurrent;
    case 'curve': {
      const p = d.points;
      const first = p[0] as [number, number];
      const last = p[p.length - 1] as [number, number];
      if (treq >= first[1]) return first[0];
      if (treq < last[1]) return null;
      for (let i = 0; i + 1 < p.length; i++) {
        const [i1, t1] = p[i] as [number, number];
        const [i2, t2] = p[i + 1] as [number, number];
        if (treq <= t1 && treq >= t2) {
          if (t1 === t2) return i1;
          const f = (Math.log(treq) - Math.log(t1)) / (Math.log(t2) - Math.log(t1));
          return Math.exp(Math.log(i1) + f * (Math.log(i2) - Math.log(i1)));
        }
      }
      return null;
    }
  }
}

/** Clearing time at If (method.md); If = Infinity stands for the 0 Ω loop. */
export function clearingTimeOf(d: Device, ia: number | null, If: number): number | null {
  if (d.type !== 'curve') {
    if (If === Infinity) return 0.1;
    return ia !== null && atMost(ia, If) ? 0.1 : null;
  }
  const p = d.points;
  const first = p[0] as [number, number];
  const last = p[p.length - 1] as [number, number];
  if (If >= last[0]) return last[1];
  if (If < first[0]) return null;
  for (let i = 0; i + 1 < p.length; i++) {
    const [i1, t1] = p[i] as [number, number];
    const [i2, t2] = p[i + 1] as [number, number];
    if (If >= i1 && If <= i2) {
      const f = (Math.log(If) - Math.log(i1)) / (Math.log(i2) - Math.log(i1));
      return Math.exp(Math.log(t1) + f * (Math.log(t2) - Math.log(t1)));
    }
  }
  return null;
}

/** Positive root of |A + L·z| = B in L; 0 when |A| ≥ B. */
export function solveLength(A: Cx, z: Cx, B: number): number {
  if (mag(A) >= B) return 0;
  const a = z.re * z.re + z.im * z.im;
  if (a === 0) return Infinity;
  const h = A.re * z.re + A.im * z.im;
  const c0 = A.re * A.re + A.im * A.im - B * B;
  return (-h + Math.sqrt(h * h - a * c0)) / a;
}

/** The largest |Ze| along unit phasor u with |Ze·u + Σ| ≤ B (method-depth.md §9). */
export function solveZe(u: Cx, sigma: Cx, B: number): number {
  if (mag(sigma) >= B) return 0;
  const h = u.re * sigma.re + u.im * sigma.im;
  return -h + Math.sqrt(h * h - mag(sigma) ** 2 + B * B);
}

interface Tree {
  node: Map<string, JobNode>;
  feeder: Map<string, Link>; // node id -> the link arriving at it
  below: Map<string, Link[]>; // node id -> links leaving it, file order
  supplyOf: Map<string, SupplyNode | null>; // link id -> its supply
  pathOf: Map<string, Link[]>; // link id -> links from the supply down to it, itself included
}

function tree(job: Job): Tree {
  const node = new Map(job.nodes.map((n) => [n.id, n] as const));
  const feeder = new Map<string, Link>();
  const below = new Map<string, Link[]>();
  for (const l of job.links) {
    feeder.set(l.to, l);
    below.set(l.from, [...(below.get(l.from) ?? []), l]);
  }
  const supplyOf = new Map<string, SupplyNode | null>();
  const pathOf = new Map<string, Link[]>();
  for (const l of job.links) {
    const path: Link[] = [l];
    let at = l.from;
    const seen = new Set<string>();
    while (feeder.has(at) && !seen.has(at)) {
      seen.add(at);
      const up = feeder.get(at) as Link;
      path.unshift(up);
      at = up.from;
    }
    const top = node.get(at);
    supplyOf.set(l.id, top?.kind === 'supply' ? top : null);
    pathOf.set(l.id, path);
  }
  return { node, feeder, below, supplyOf, pathOf };
}

/** Points at a node or anywhere below it. */
function pointsBelow(t: Tree, id: string): PointNode[] {
  const out: PointNode[] = [];
  const stack = [id];
  while (stack.length) {
    const here = stack.pop() as string;
    const n = t.node.get(here);
    if (n?.kind === 'point') out.push(n);
    for (const l of t.below.get(here) ?? []) stack.push(l.to);
  }
  return out;
}

export function roleOf(t: { node: Map<string, JobNode> }, l: Link): XCircuit['role'] {
  if (t.node.get(l.to)?.kind === 'point') return 'final-subcircuit';
  if (t.node.get(l.from)?.kind === 'supply') return 'consumer-mains';
  return 'submain';
}

export function supplyPhases(job: Job, s: SupplyNode): Phases {
  if (s.phases) return s.phases;
  const t = tree(job);
  return pointsBelow(t, s.id).some((p) => p.phases === 3) ? 3 : 1;
}

export function linkPhases(job: Job, l: Link): Phases {
  if (l.phases) return l.phases;
  const t = tree(job);
  const s = t.supplyOf.get(l.id);
  if (!s) return 1;
  if (supplyPhases(job, s) === 1) return 1;
  if (roleOf(t, l) !== 'final-subcircuit') return 3;
  return pointsBelow(t, l.to).some((p) => p.phases === 3) ? 3 : 1;
}

/** The link whose device protects `l` (method.md), or null. */
function protectorOf(t: Tree, l: Link): Link | null {
  let here: Link | undefined = l;
  while (here) {
    if (here.device) return here;
    if (t.node.get(here.from)?.kind !== 'point') return null;
    here = t.feeder.get(here.from);
  }
  return null;
}

function requiredTimeOf(b: Basis, t: Tree, l: Link, prot: Link | null): number | null {
  if (l.requiredTime !== undefined) return l.requiredTime;
  if (roleOf(t, l) !== 'final-subcircuit') return 5;
  const far = t.node.get(l.to) as PointNode;
  const rating = prot?.device?.rating;
  if (b.basis === 'au-nz') {
    if (far.handHeld === true) return 0.4;
    if (rating === undefined) return null;
    return far.use === 'socket-outlets' && rating <= 63 ? 0.4 : 5;
  }
  if (rating === undefined) return null;
  return rating <= 32 ? 0.4 : 5;
}

function sourceZe(b: Basis, s: SupplyNode): Cx | null {
  const src = s.source;
  if (src.type === 'impedance') return cx(src.r, src.x);
  if (src.type === 'fault-current') {
    const z = b.U0 / src.current;
    const xr = src.xr ?? 1;
    const R = z / Math.sqrt(1 + xr * xr);
    return cx(R, R * xr);
  }
  return null;
}

export function sourcePhasor(s: SupplyNode): Cx {
  const src = s.source;
  if (src.type === 'impedance') {
    const m = Math.hypot(src.r, src.x);
    return m === 0 ? cx(1, 0) : cx(src.r / m, src.x / m);
  }
  if (src.type === 'fault-current') {
    const xr = src.xr ?? 1;
    return cx(1 / Math.sqrt(1 + xr * xr), xr / Math.sqrt(1 + xr * xr));
  }
  return cx(1, 0);
}

interface Load {
  share: number;
  pf: number;
}

/** Ib and power factor of every link (method-depth.md §2), bottom-up. */
function designCurrents(job: Job, t: Tree, phases: Map<string, Phases>): Map<string, { ib: number | null; pf: number | null }> {
  const out = new Map<string, { ib: number | null; pf: number | null }>();
  const get = (l: Link): { ib: number | null; pf: number | null } => {
    const done = out.get(l.id);
    if (done) return done;
    const ph = phases.get(l.id) as Phases;
    const items: Load[] = [];
    const n = t.node.get(l.to);
    if (n?.kind === 'point' && (n.current ?? 0) > 0) {
      const I = n.current as number;
      const lp = n.phases ?? 1;
      items.push({ share: ph === 3 && lp === 1 ? I / 3 : I, pf: n.powerFactor ?? 0.8 });
    }
    for (const c of t.below.get(l.to) ?? []) {
      const r = get(c);
      if (r.ib === null) continue;
      const cp = phases.get(c.id) as Phases;
      items.push({ share: ph === 3 && cp === 1 ? r.ib / 3 : r.ib, pf: r.pf as number });
    }
    const d = n?.kind === 'board' ? (n.diversity ?? 1) : 1;
    const sum = items.reduce((a, i) => a + i.share, 0);
    let ib: number | null;
    if (l.designCurrent !== undefined) ib = l.designCurrent;
    else ib = items.length ? d * sum : null;
    let pf: number | null;
    if (ib === null) pf = null;
    else if (l.powerFactor !== undefined) pf = l.powerFactor;
    else if (items.length && sum > 0) pf = items.reduce((a, i) => a + i.share * i.pf, 0) / sum;
    else pf = 0.8;
    const r = { ib, pf };
    out.set(l.id, r);
    return r;
  };
  for (const l of job.links) get(l);
  return out;
}

function vdOf(b: Basis, l: Link, ph: Phases, ib: number, pf: number, cab = l.cable): number {
  const n = cab.parallel ?? 1;
  const x = cab.reactance ?? b.x;
  const sin = Math.sqrt(Math.max(0, 1 - pf * pf));
  const bf = ph === 1 ? 2 : 1;
  return (100 * bf * ib * cab.length * ((b.rhoV[cab.material] / cab.active) * pf + x * sin)) / (n * b.U0);
}

function vdLimitOf(b: Basis, t: Tree, l: Link): number | null {
  const far = t.node.get(l.to);
  if (far?.kind !== 'point') return null;
  if (l.voltageDropLimit !== undefined) return l.voltageDropLimit;
  if (b.vdLimit !== undefined) return b.vdLimit;
  if (b.basis === 'iec' && far.use === 'lighting') return 3;
  return 5;
}

/** Fault-level contribution of one link (method-depth.md §5). */
function faultZ(b: Basis, l: Link, ph: Phases): Cx {
  const cab = l.cable;
  const n = cab.parallel ?? 1;
  const x = cab.reactance ?? b.x;
  const zp = cx((b.rhoSc[cab.material] * cab.length) / cab.active, x * cab.length);
  return scale(zp, (ph === 3 ? 1 : 2) / n);
}

function faultSource(b: Basis, s: SupplyNode, ph: Phases): Cx | null {
  if (s.maxFault) {
    const z = (b.cmax * b.U0) / s.maxFault.current;
    const xr = s.maxFault.xr ?? 1;
    const R = z / Math.sqrt(1 + xr * xr);
    return cx(R, R * xr);
  }
  const ze = sourceZe(b, s);
  if (!ze) return null;
  return ph === 3 ? scale(ze, 0.5) : ze;
}

/** What the loop check gives for `l` with its cable possibly replaced, or its protecting device. */
interface Loop {
  ia: number | null;
  B: number | null; // c·U0/Ia
  zs: number | null;
  own: number | null;
  upstream: number | null;
  limit: number | null;
  If: number | null;
  t: number | null;
  ratio: number | null;
  maxLength: number | null;
  status: St;
}

export function calculate(job: Job): XResults {
  const b = basisOf(job);
  const t = tree(job);
  const phases = new Map<string, Phases>(job.links.map((l) => [l.id, linkPhases(job, l)]));
  const dc = designCurrents(job, t, phases);
  const byId = new Map(job.links.map((l) => [l.id, l] as const));

  const loopOf = (l: Link, opts: { cable?: Link['cable']; device?: Device } = {}): Loop & { prot: Link | null; treq: number | null } => {
    const supply = t.supplyOf.get(l.id) ?? null;
    const prot = protectorOf(t, l);
    const device = opts.device ?? prot?.device;
    const protForT = prot && opts.device ? { ...prot, device: opts.device } : prot;
    const treq = requiredTimeOf(b, t, l, protForT);
    const path = t.pathOf.get(l.id) as Link[];
    const z = (k: Link) => (k.id === l.id && opts.cable ? loopZ(b, k, opts.cable) : loopZ(b, k));
    const none: Loop = { ia: null, B: null, zs: null, own: null, upstream: null, limit: null, If: null, t: null, ratio: null, maxLength: null, status: 'unchecked' };
    // no supply reaches the link: nothing of the loop check is given (t_req included)
    if (!supply) return { ...none, prot, treq: null };
    const ze = sourceZe(b, supply);
    const sigma = path.reduce((a, k) => add(a, z(k)), ZERO);
    const zsC = ze ? add(ze, sigma) : null;
    const zs = zsC ? mag(zsC) : null;
    // an unprotected link: zs and c·U0/zs still given; every field that needs a device is null
    if (!prot || !device) return { ...none, zs, If: zs === null || zs === 0 ? null : (b.c * b.U0) / zs, prot, treq: null };
    const pi = path.findIndex((k) => k.id === prot.id);
    const upC = path.slice(0, pi).reduce((a, k) => add(a, z(k)), ZERO);
    const ownC = path.slice(pi).reduce((a, k) => add(a, z(k)), ZERO);
    const own = mag(ownC);
    const upstream = mag(upC);
    const ia = treq === null ? null : tripCurrentOf(b, device, treq);
    const If = zs === null ? null : zs === 0 ? Infinity : (b.c * b.U0) / zs;
    const clearing = If === null ? null : clearingTimeOf(device, ia, If);
    const hasRcd = prot.rcd !== undefined;
    const failSt: St = hasRcd ? 'rcd' : 'fail';
    if (ia === null) {
      return { ia, B: null, zs, own, upstream, limit: null, If: If === Infinity ? null : If, t: clearing, ratio: null, maxLength: null, status: failSt, prot, treq };
    }
    const B = (b.c * b.U0) / ia;
    const known = ze !== null;
    const limit = known ? B : b.s * B;
    const ratio = known ? (zs as number) / B : Math.max(own / (b.s * B), upstream / ((1 - b.s) * B));
    const before = known ? add(ze as Cx, path.slice(0, -1).reduce((a, k) => add(a, z(k)), ZERO)) : path.slice(pi, -1).reduce((a, k) => add(a, z(k)), ZERO);
    const cab = opts.cable ?? l.cable;
    const perM = loopZ(b, l, { ...cab, length: 1 });
    const maxLength = solveLength(before, perM, limit);
    let pass = atMost(ratio, 1);
    if (known && clearing === null && If !== null) pass = false; // a curve below its lowest current
    return { ia, B, zs, own, upstream, limit, If: If === Infinity ? null : If, t: clearing, ratio, maxLength, status: pass ? 'pass' : failSt, prot, treq };
  };

  const circuits: XCircuit[] = [];
  const totals = new Map<string, number>();
  for (const l of job.links) {
    const supply = t.supplyOf.get(l.id) ?? null;
    const role = roleOf(t, l);
    const ph = phases.get(l.id) as Phases;
    const lp = loopOf(l);
    const prot = lp.prot;
    const known = supply ? sourceZe(b, supply) !== null : false;
    const { ib, pf } = dc.get(l.id) as { ib: number | null; pf: number | null };
    const path = t.pathOf.get(l.id) as Link[];

    // voltage drop
    const vd = ib === null ? null : vdOf(b, l, ph, ib, pf as number);
    const upTotal = path.slice(0, -1).reduce((a, k) => {
      const r = dc.get(k.id) as { ib: number | null; pf: number | null };
      return a + (r.ib === null ? 0 : vdOf(b, k, phases.get(k.id) as Phases, r.ib, r.pf as number));
    }, 0);
    // the total runs from a supply: none when no supply reaches the link
    const vdTotal = vd === null || !supply ? null : upTotal + vd;
    if (vdTotal !== null) totals.set(l.id, vdTotal);
    const vdLimit = vdLimitOf(b, t, l);
    const voltageStatus: Ck = vdTotal === null || vdLimit === null || !supply ? 'unchecked' : atMost(vdTotal, vdLimit) ? 'pass' : 'fail';

    // capacity
    const cab = l.cable;
    const n = cab.parallel ?? 1;
    let iz: number | null = null;
    if (cab.capacity !== undefined) iz = cab.capacity;
    else if (b.basis === 'iec') {
      const tv = tableIz(cab.material, cab.insulation ?? 'pvc', ph === 3 ? 3 : 2, cab.active);
      iz = tv === null ? null : tv * (cab.derating ?? 1) * n;
    }
    let capacityStatus: Ck = 'unchecked';
    if (ib !== null && iz !== null) {
      const In = prot?.device?.rating;
      capacityStatus = In === undefined ? (atMost(ib, iz) ? 'pass' : 'fail') : atMost(ib, In) && atMost(In, iz) ? 'pass' : 'fail';
    }

    // fault level at the origin
    let faultLevel: number | null = null;
    if (supply) {
      const src = faultSource(b, supply, supplyPhases(job, supply));
      if (src) {
        const zf = path.slice(0, -1).reduce((a, k) => add(a, faultZ(b, k, phases.get(k.id) as Phases)), src);
        faultLevel = mag(zf) === 0 ? null : (b.cmax * b.U0) / mag(zf);
      }
    }
    const brk = l.device?.breaking;
    const breakingStatus: Ck = brk === undefined || faultLevel === null ? 'unchecked' : atMost(faultLevel, brk * 1000) ? 'pass' : 'fail';

    // withstand
    let earthMinArea: number | null = null;
    let withstandStatus: Ck = 'unchecked';
    if (known && prot?.device && lp.t !== null) {
      const lt = prot.device.letThrough;
      let E: number | null;
      if (lp.If === null) E = lt ?? null; // the 0 Ω loop
      else E = lt === undefined ? lp.If * lp.If * lp.t : Math.min(lp.If * lp.If * lp.t, lt);
      if (E !== null) {
        const k = kValue(cab.earthMaterial ?? cab.material, cab.insulation ?? 'pvc', cab.earthInCable ?? true);
        earthMinArea = Math.sqrt(E) / k;
        withstandStatus = atMost(earthMinArea, n * cab.earth) ? 'pass' : 'fail';
      }
    }

    // measured
    const zem = supply?.measured?.ze ?? 0;
    const theta = l.measured?.temperature ?? 20;
    const rhoTheta = RHO20[cab.material] * (1 + ALPHA[cab.material] * (theta - 20));
    const F = b.measuredRule === 'fixed-factor' ? 1 / b.measuredFactor : b.rho[cab.material] / rhoTheta;
    const testLimit = supply && prot && lp.B !== null ? zem + (lp.B - zem) / F : null;
    let measured: XCircuit['measured'] = null;
    if (l.measured) {
      const corrected = zem + (l.measured.zs - zem) * F;
      if (!supply || !prot || lp.B === null) measured = { zs: l.measured.zs, corrected, ratio: null, status: 'unchecked' };
      else {
        const ratio = corrected / lp.B;
        measured = { zs: l.measured.zs, corrected, ratio, status: atMost(ratio, 1) ? 'pass' : prot.rcd ? 'rcd' : 'fail' };
      }
    }

    // fixes
    const fixes: XFix[] = [];
    const loopFails = lp.status === 'fail' || lp.status === 'rcd';
    if (loopFails || voltageStatus === 'fail') {
      if (loopFails && lp.maxLength !== null && lp.maxLength > 0 && lp.maxLength < cab.length) fixes.push({ kind: 'length', maxLength: lp.maxLength });
      const size = sizeFix(l, cab, prot !== null && lp.status !== 'unchecked', voltageStatus !== 'unchecked', upTotal, vdLimit, ib, pf, ph);
      if (size) fixes.push(size);
      if (loopFails && prot?.device?.type === 'mcb') {
        const pib = (dc.get(prot.id) as { ib: number | null }).ib;
        const d = prot.device;
        let best: XFix | null = null;
        for (const rating of RATINGS) {
          if (rating > d.rating || (pib !== null && rating < pib)) continue;
          for (const curve of CURVES) {
            if (CURVES.indexOf(curve) > CURVES.indexOf(d.curve)) continue;
            const r = loopOf(l, { device: { ...d, curve, rating } });
            if (r.ratio !== null && r.status === 'pass') best = { kind: 'device', curve, rating };
          }
        }
        if (best) fixes.push(best);
      }
      if (lp.status === 'fail' && prot && !prot.rcd) fixes.push({ kind: 'rcd', sensitivity: 0.03 });
    }

    // verdict
    const others: Ck[] = [voltageStatus, capacityStatus, breakingStatus, withstandStatus];
    let verdict: St;
    if (lp.status === 'fail' || others.includes('fail') || measured?.status === 'fail') verdict = 'fail';
    else if (lp.status === 'rcd' || measured?.status === 'rcd') verdict = 'rcd';
    else if (lp.status === 'pass') verdict = 'pass';
    else verdict = 'unchecked';

    circuits.push({
      link: l.id,
      role,
      method: supply ? (known ? 'known-source' : 'unknown-source') : null,
      protectedBy: prot?.id ?? null,
      tripCurrent: lp.ia,
      requiredTime: lp.treq,
      zs: lp.zs,
      own: lp.own,
      upstream: lp.upstream,
      limit: lp.limit,
      faultCurrent: known ? lp.If : null,
      clearingTime: known ? lp.t : null,
      ratio: lp.ratio,
      maxLength: lp.maxLength,
      status: lp.status,
      phases: ph,
      designCurrent: ib,
      powerFactor: pf,
      voltageDrop: vd,
      voltageDropTotal: vdTotal,
      voltageDropLimit: vdLimit,
      voltageStatus,
      capacity: iz,
      capacityStatus,
      faultLevel,
      breakingStatus,
      earthMinArea,
      withstandStatus,
      testLimit,
      measured,
      fixes,
      verdict,
    });
  }

  function sizeFix(l: Link, cab: Link['cable'], loopApplies: boolean, vdApplies: boolean, upTotal: number, vdLimit: number | null, ib: number | null, pf: number | null, ph: Phases): XFix | null {
    for (const a of STANDARD) {
      if (a < cab.active) continue;
      for (const e of STANDARD) {
        if (e < cab.earth || e > Math.max(a, cab.earth)) continue;
        const trial = { ...cab, active: a, earth: e };
        if (loopApplies) {
          const r = loopOf(l, { cable: trial });
          if (r.ratio === null || r.status !== 'pass') continue;
        }
        if (vdApplies && ib !== null && vdLimit !== null) {
          if (!atMost(upTotal + vdOf(b, l, ph, ib, pf as number, trial), vdLimit)) continue;
        }
        return { kind: 'size', active: a, earth: e };
      }
    }
    return null;
  }

  // worst path
  let worst: XResults['worst'] = null;
  for (const c of circuits) {
    if (c.status === 'unchecked' || c.ratio === null) continue;
    if (!worst || c.ratio > worst.ratio) {
      const l = byId.get(c.link) as Link;
      const path = t.pathOf.get(l.id) as Link[];
      const ids: string[] = [path[0]?.from as string];
      for (const k of path) ids.push(k.id, k.to);
      worst = { link: c.link, ratio: c.ratio, path: ids };
    }
  }

  // supplies
  const supplies: XSupply[] = job.nodes
    .filter((nd): nd is SupplyNode => nd.kind === 'supply')
    .map((s) => {
      const ph = supplyPhases(job, s);
      const src = faultSource(b, s, ph);
      const faultLevel = src && mag(src) > 0 ? (b.cmax * b.U0) / mag(src) : null;
      const u = sourcePhasor(s);
      let maxZe: number | null = null;
      for (const l of job.links) {
        if (t.supplyOf.get(l.id)?.id !== s.id) continue;
        const lp = loopOf(l);
        if (!lp.prot || lp.B === null) continue;
        const sigma = (t.pathOf.get(l.id) as Link[]).reduce((a, k) => add(a, loopZ(b, k)), ZERO);
        const v = solveZe(u, sigma, lp.B);
        maxZe = maxZe === null ? v : Math.min(maxZe, v);
      }
      return { node: s.id, phases: ph, faultLevel, maxZe, minFaultCurrent: maxZe === null || maxZe === 0 ? null : b.U0 / maxZe };
    });

  const c4 = (): Counts4 => ({ pass: 0, fail: 0, rcd: 0, unchecked: 0 });
  const c3 = (): Counts3 => ({ pass: 0, fail: 0, unchecked: 0 });
  const summary: XResults['summary'] = { ...c4(), verdict: c4(), checks: { voltage: c3(), capacity: c3(), breaking: c3(), withstand: c3(), measured: c4() } };
  for (const c of circuits) {
    summary[c.status] += 1;
    summary.verdict[c.verdict] += 1;
    summary.checks.voltage[c.voltageStatus] += 1;
    summary.checks.capacity[c.capacityStatus] += 1;
    summary.checks.breaking[c.breakingStatus] += 1;
    summary.checks.withstand[c.withstandStatus] += 1;
    if (c.measured) summary.checks.measured[c.measured.status] += 1;
  }
  return { circuits, worst, supplies, summary };
}
