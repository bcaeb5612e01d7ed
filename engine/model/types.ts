// The job: one installation design, as saved in a `.lwj` file (format version 2; version 1 files
// are migrated on load).
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
  /** Voltage-drop limit at every point, % of U0 (overrides the basis). */
  voltageDropLimit?: number;
  /** Resistivity in normal service for the voltage drop, Ω·mm²/m. */
  voltageDropResistivity?: Partial<Record<Material, number>>;
  /** cmax, the voltage factor for maximum fault currents. */
  maxVoltageFactor?: number;
  /** Resistivity at 20 °C for fault levels, Ω·mm²/m. */
  shortCircuitResistivity?: Partial<Record<Material, number>>;
  /** How a measured loop impedance is corrected: by temperature (default) or a fixed factor. */
  measuredRule?: MeasuredRule;
  /** The fixed factor: a reading must not exceed this share of the limit (default 0.8). */
  measuredFactor?: number;
}

export type MeasuredRule = 'temperature' | 'fixed-factor';
export type Phases = 1 | 3;
export type Insulation = 'pvc' | 'xlpe';

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

export interface MaxFault {
  /** The distributor's maximum prospective short-circuit current at the supply, A. */
  current: number;
  /** X/R (default 1). */
  xr?: number;
}

export interface SupplyReading {
  /** Measured Ze, Ω. */
  ze: number;
  date?: string;
  instrument?: string;
}

export interface SupplyNode extends NodeBase {
  kind: 'supply';
  source: Source;
  phases?: Phases;
  maxFault?: MaxFault;
  measured?: SupplyReading;
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
  phases?: Phases;
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
  insulation?: Insulation;
  /** The earth is a core of the cable (default true) rather than a separate conductor. */
  earthInCable?: boolean;
  /** Iz of all parallel sets together, A, as installed (after derating). */
  capacity?: number;
  /** Grouping and ambient factors multiplied together (0 < f ≤ 1). */
  derating?: number;
}

interface DeviceBase {
  rating: number;
  /** Breaking capacity, kA. */
  breaking?: number;
  /** Published let-through energy I²t, A²s. */
  letThrough?: number;
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
  phases?: Phases;
  /** A maximum demand assessed some other way, A. */
  designCurrent?: number;
  powerFactor?: number;
  /** %, overrides the rules for this link. */
  voltageDropLimit?: number;
  measured?: LinkReading;
}

export interface LinkReading {
  /** Measured Zs at the far end, Ω. */
  zs: number;
  /** Conductor temperature at the test, °C (default 20). */
  temperature?: number;
  date?: string;
  instrument?: string;
}

export interface Job {
  format: 'loopwright.job';
  version: 2;
  job: JobDetails;
  rules: Rules;
  nodes: JobNode[];
  links: Link[];
  /** Unknown top-level keys from the file, kept so a save does not strip them. */
  extra?: Record<string, unknown>;
}

export const CURRENT_VERSION = 2;
export const FORMAT_NAME = 'loopwright.job';
