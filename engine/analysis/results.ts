// The results document (format `loopwright.results`, version 2): what `analyse(job)` returns
// and what `check --json` prints. Field names, units and nulls follow the public format.

import type { BasisName, Curve, Phases } from '../model/types.js';

export type LinkRole = 'consumer-mains' | 'submain' | 'final-subcircuit';
export type Method = 'known-source' | 'unknown-source';
export type Status = 'pass' | 'fail' | 'rcd' | 'unchecked';
/** The status of a check that has no RCD case (voltage, capacity, breaking, withstand). */
export type CheckStatus = 'pass' | 'fail' | 'unchecked';

/** A change that makes a failing link pass, everything else unchanged. */
export type Fix =
  | { kind: 'length'; maxLength: number }
  | { kind: 'size'; active: number; earth: number }
  | { kind: 'device'; curve: Curve; rating: number }
  | { kind: 'rcd'; sensitivity: number };
export type FixKind = Fix['kind'];

export interface MeasuredResult {
  /** The reading, Ω. */
  zs: number;
  /** The reading corrected to fault temperature (or by the fixed factor), Ω. */
  corrected: number;
  /** corrected / (c·U0/Ia); null when unprotected or Ia unknown. */
  ratio: number | null;
  status: Status;
}

export interface CircuitResult {
  link: string;
  name: string | null;
  from: string;
  to: string;
  role: LinkRole;
  /** null when no supply reaches the link. */
  method: Method | null;
  /** Id of the link whose device protects this one; null when unprotected. */
  protectedBy: string | null;
  /** Device label, or a short mark such as `C20`; null when unprotected. */
  device: string | null;
  /** Ia (A). */
  tripCurrent: number | null;
  /** t_req (s). */
  requiredTime: number | null;
  /** |Ze + Σ links| at the far end (Ω), known source only. */
  zs: number | null;
  /** |Σ links from the protecting link's origin to the far end| (Ω). */
  own: number | null;
  /** |Σ drawn links from the supply to the protecting link's origin| (Ω), Ze excluded. */
  upstream: number | null;
  /** c·U0/Ia (known source) or s·c·U0/Ia (unknown source), Ω. */
  limit: number | null;
  /** c·U0/zs (A), known source only. */
  faultCurrent: number | null;
  /** The device's clearing time at faultCurrent (s). */
  clearingTime: number | null;
  ratio: number | null;
  /** m. */
  maxLength: number | null;
  status: Status;
  notes: string[];
  /** 1 or 3, stated or derived. */
  phases: Phases;
  /** Ib, A; null when nothing below has a current. */
  designCurrent: number | null;
  /** cos φ used for the drop; null with Ib. */
  powerFactor: number | null;
  /** This link's own drop, % of U0; null with Ib. */
  voltageDrop: number | null;
  /** Supply to this link's far end, % of U0; null with Ib. */
  voltageDropTotal: number | null;
  /** %, for links arriving at a point; else null. */
  voltageDropLimit: number | null;
  voltageStatus: CheckStatus;
  /** Iz, A; null when unknown. */
  capacity: number | null;
  capacityStatus: CheckStatus;
  /** Maximum prospective fault current at the link's origin, A. */
  faultLevel: number | null;
  breakingStatus: CheckStatus;
  /** S_pe,min, mm²; null when not checked. */
  earthMinArea: number | null;
  withstandStatus: CheckStatus;
  /** Largest measured Zs that passes, Ω, at the measured temperature (else 20 °C). */
  testLimit: number | null;
  measured: MeasuredResult | null;
  fixes: Fix[];
  verdict: Status;
}

export interface WorstPath {
  link: string;
  ratio: number;
  /** Node and link ids alternately, from the supply to the worst link's far end. */
  path: string[];
}

export interface Summary {
  pass: number;
  fail: number;
  rcd: number;
  unchecked: number;
  /** Counts of the verdicts. */
  verdict: StatusCounts;
  checks: {
    voltage: CheckCounts;
    capacity: CheckCounts;
    breaking: CheckCounts;
    withstand: CheckCounts;
    /** Over the links that carry a reading. */
    measured: StatusCounts;
  };
}

export interface StatusCounts {
  pass: number;
  fail: number;
  rcd: number;
  unchecked: number;
}

export interface CheckCounts {
  pass: number;
  fail: number;
  unchecked: number;
}

export interface SupplyResult {
  node: string;
  phases: Phases;
  /** Maximum prospective fault current at the supply terminals, A. */
  faultLevel: number | null;
  /** The largest source impedance for which every checked circuit still passes, Ω. */
  maxZe: number | null;
  /** U0 / maxZe, A. */
  minFaultCurrent: number | null;
  /** The link whose loop sets maxZe (not in the public format's required fields). */
  setBy: string | null;
}

export interface Results {
  format: 'loopwright.results';
  version: 2;
  basis: BasisName;
  circuits: CircuitResult[];
  worst: WorstPath | null;
  supplies: SupplyResult[];
  summary: Summary;
}
