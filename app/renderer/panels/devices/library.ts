// The built-in device library: breaker curves B/C/D and gG fuse curves, each entry with its
// source. Pure data and curve building (no DOM): picking an entry fills a link's device with
// every field the job format requires for its kind, and nothing more.
//
// Breakers: the job stores only curve and rating; the engine takes Ia from the basis multiple
// (rules.multiples), so an entry never carries a trip current of its own.
//
// gG fuses: a time–current curve through the upper limits IEC 60269-1 sets for a gG fuse-link
// (the slowest fuse the standard allows), so a loop check against it is on the safe side:
//   - the conventional fusing current If = 1.6 In within the conventional time (Table 2);
//   - Imax at 5 s and Imax at 0.1 s (Table 3, the pre-arcing gates).
// Values are from memory and must be checked against the standard and the maker's published
// curve before they are relied on; a maker's curve entered as "my device" is better.

import type { Curve, CurveDevice, Device, McbDevice } from '../../../../engine/index.js';

export interface LibraryEntry {
  /** Stable id, e.g. `mcb-C-20`, `gG-32`. */
  id: string;
  /** What the picker shows. */
  name: string;
  /** Where its values come from. */
  source: string;
  /** The device exactly as it goes into the link (required fields complete). */
  device: Device;
  /** The family the picker groups it under. */
  group: string;
}

/** Rated currents offered for breakers, A (IEC 60898-1 preferred values, from memory). */
export const BREAKER_RATINGS: readonly number[] = [6, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125];

const BREAKER_SOURCE =
  'IEC 60898-1 curve %C (instantaneous range, from memory); Ia = the basis multiple × In from the job\'s rules (AS/NZS 3000:2018 Table B5.1 note under au-nz, IEC 60898-1 upper limit under iec)';

function breaker(curve: Curve, rating: number): LibraryEntry {
  const device: McbDevice = { type: 'mcb', curve, rating };
  return {
    id: `mcb-${curve}-${rating}`,
    name: `${curve}${rating} breaker`,
    source: BREAKER_SOURCE.replace('%C', curve),
    device,
    group: `Breakers, curve ${curve}`,
  };
}

/** The gates of IEC 60269-1 for one gG rating (A, s). */
export interface GgGates {
  rating: number;
  /** Conventional non-fusing current Inf (A), Table 2. */
  nonFusing: number;
  /** Conventional fusing current If (A), Table 2. */
  fusing: number;
  /** Conventional time (s), Table 2. */
  conventionalTime: number;
  /** Table 3: Imin(10 s), Imax(5 s), Imin(0.1 s), Imax(0.1 s), A. */
  min10: number;
  max5: number;
  min01: number;
  max01: number;
}

/**
 * IEC 60269-1 Table 3 gates for gG fuse-links (Imin 10 s, Imax 5 s, Imin 0.1 s, Imax 0.1 s),
 * from memory: check against the standard.
 */
const GG_TABLE3: ReadonlyArray<[number, number, number, number, number]> = [
  [16, 33, 65, 85, 150],
  [20, 42, 85, 110, 200],
  [25, 52, 110, 150, 260],
  [32, 75, 150, 200, 350],
  [40, 95, 190, 260, 450],
  [50, 125, 250, 350, 610],
  [63, 160, 320, 450, 820],
  [80, 215, 425, 610, 1100],
  [100, 290, 580, 820, 1450],
  [125, 355, 715, 1100, 1910],
  [160, 460, 950, 1450, 2590],
  [200, 610, 1250, 1910, 3420],
  [250, 750, 1650, 2590, 4500],
  [315, 1050, 2200, 3420, 6000],
  [400, 1420, 2840, 4500, 8060],
];

/**
 * IEC 60269-1 Table 2 for gG (from memory): Inf 1.25 In and If 1.6 In for In ≥ 16 A; the
 * conventional time 1 h up to 63 A, 2 h up to 160 A, 3 h up to 400 A.
 */
function conventionalTime(rating: number): number {
  if (rating <= 63) return 3600;
  if (rating <= 160) return 7200;
  return 10800;
}

export const GG_GATES: readonly GgGates[] = GG_TABLE3.map(([rating, min10, max5, min01, max01]) => ({
  rating,
  nonFusing: 1.25 * rating,
  fusing: 1.6 * rating,
  conventionalTime: conventionalTime(rating),
  min10,
  max5,
  min01,
  max01,
}));

export const GG_SOURCE =
  'IEC 60269-1 gG fuse-link, upper limits: If = 1.6 In at the conventional time (Table 2), Imax at 5 s and at 0.1 s (Table 3); from memory, check against the standard and the maker\'s curve';

/** The curve through the gG upper gates: [If, conventional time], [Imax 5 s, 5], [Imax 0.1 s, 0.1]. */
export function ggCurve(g: GgGates): Array<[number, number]> {
  return [
    [g.fusing, g.conventionalTime],
    [g.max5, 5],
    [g.max01, 0.1],
  ];
}

function fuse(g: GgGates): LibraryEntry {
  const device: CurveDevice = { type: 'curve', rating: g.rating, points: ggCurve(g), label: `${g.rating} A gG` };
  return { id: `gG-${g.rating}`, name: `${g.rating} A gG fuse`, source: GG_SOURCE, device, group: 'Fuses, gG (IEC 60269-1)' };
}

export const LIBRARY: readonly LibraryEntry[] = [
  ...(['B', 'C', 'D'] as const).flatMap((c) => BREAKER_RATINGS.map((r) => breaker(c, r))),
  ...GG_GATES.map(fuse),
];

export function libraryEntry(id: string): LibraryEntry | undefined {
  return LIBRARY.find((e) => e.id === id);
}

/** A copy of an entry's device, safe to put into a job. */
export function deviceFromEntry(entry: LibraryEntry): Device {
  return JSON.parse(JSON.stringify(entry.device)) as Device;
}
