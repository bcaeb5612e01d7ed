// The results document (format `loopwright.results`, version 1): what `analyse(job)` returns
// and what `check --json` prints. Field names, units and nulls follow the public format.

import type { BasisName } from '../model/types.js';

export type LinkRole = 'consumer-mains' | 'submain' | 'final-subcircuit';
export type Method = 'known-source' | 'unknown-source';
export type Status = 'pass' | 'fail' | 'rcd' | 'unchecked';

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
}

export interface Results {
  format: 'loopwright.results';
  version: 1;
  basis: BasisName;
  circuits: CircuitResult[];
  worst: WorstPath | null;
  summary: Summary;
}
