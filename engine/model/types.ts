// The job: one installation design, as saved in a `.lwj` file (format version 1).
// Field names and units follow the public job format; see engine/model/FORMAT.md.

export type Material = 'Cu' | 'Al';
export type BasisName = 'au-nz' | 'iec';
export type Curve = 'B' | 'C' | 'D';
export type PointUse = 'socket-outlets' | 'lighting' | 'fixed-equipment' | 'motor' | 'other';

export interface JobDetails {
  title: string;
  site: string;
  client: string;
  designer: string;
  reference: string;
  revision: string;
  date: string;
  notes: string;
}

export interface Rules {
  basis: BasisName;
  /** U0, nominal phase-to-earth voltage (V). */
  voltage?: number;
  /** c, the voltage factor. */
  voltageFactor?: number;
  /** s, the share of the loop budget the circuit may use when the source is unknown. */
  unknownSourceShare?: number;
  /** Per-conductor reactance, Ω/m. */
  reactance?: number;
  /** Resistivity at fault temperature, Ω·mm²/m. */
  resistivity?: Partial<Record<Material, number>>;
  /** Instantaneous trip multiples of In for breaker curves. */
  multiples?: Partial<Record<Curve, number>>;
}

export type Source =
  | { type: 'unknown' }
  | { type: 'impedance'; r: number; x: number }
  | { type: 'fault-current'; current: number; xr?: number };

export interface Position {
  x: number;
  y: number;
}

interface NodeBase {
  id: string;
  name?: string;
  notes?: string;
  at?: Position;
}

export interface SupplyNode extends NodeBase {
  kind: 'supply';
  source: Source;
}

export interface BoardNode extends NodeBase {
  kind: 'board';
  diversity?: number;
}

export interface PointNode extends NodeBase {
  kind: 'point';
  use: PointUse;
  handHeld?: boolean;
  current?: number;
  phases?: 1 | 3;
  powerFactor?: number;
}

export type JobNode = SupplyNode | BoardNode | PointNode;
export type NodeKind = JobNode['kind'];

export interface Cable {
  length: number;
  material: Material;
  active: number;
  earth: number;
  earthMaterial?: Material;
  parallel?: number;
  reactance?: number;
}

interface DeviceBase {
  rating: number;
  breaking?: number;
  label?: string;
}

export interface McbDevice extends DeviceBase {
  type: 'mcb';
  curve: Curve;
}

export interface AdjustableDevice extends DeviceBase {
  type: 'adjustable';
  instantaneous: number;
  tolerance?: number;
}

export interface CurveDevice extends DeviceBase {
  type: 'curve';
  /** Time–current points [current A, time s]: current rising, time falling. */
  points: Array<[number, number]>;
}

export interface FixedDevice extends DeviceBase {
  type: 'fixed';
  tripCurrent: number;
}

export type Device = McbDevice | AdjustableDevice | CurveDevice | FixedDevice;
export type DeviceType = Device['type'];

export interface Rcd {
  sensitivity: number;
}

export interface Link {
  id: string;
  from: string;
  to: string;
  name?: string;
  notes?: string;
  cable: Cable;
  device?: Device;
  rcd?: Rcd;
  requiredTime?: number;
}

export interface Job {
  format: 'loopwright.job';
  version: 1;
  job: JobDetails;
  rules: Rules;
  nodes: JobNode[];
  links: Link[];
  /** Unknown top-level keys from the file, kept so a save does not strip them. */
  extra?: Record<string, unknown>;
}

export const CURRENT_VERSION = 1;
export const FORMAT_NAME = 'loopwright.job';
