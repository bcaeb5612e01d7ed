// The job file's records, declared once. Everything that checks or describes a record reads
// these definitions:
//   - the loader's reporting check (check-spec.ts), which says what is wrong and where;
//   - the loader's quick check (generated/clean.ts, written from these definitions by
//     scripts/gen-schema.ts), which answers only "is this record entirely valid" and lets a
//     valid file skip the reporting check;
//   - the published JSON Schema of the job file (schema/job.schema.json, written by the same
//     script). A test regenerates both and fails when either is out of date.
// The rules that span records (unique ids, links joining nodes, one feeder per node, no cycles,
// phases) are in graph-rules.ts and phase-rules.ts; JSON Schema cannot state them, so the
// schema's descriptions mention them.

import type { NumberRule } from './fields.js';

export interface NumberSpec {
  kind: 'number';
  rule: NumberRule;
}
export interface TextSpec {
  kind: 'text';
  /** Must hold a character other than white space. */
  nonEmpty?: boolean;
}
export interface ChoiceSpec {
  kind: 'choice';
  values: readonly (string | number)[];
}
export interface BooleanSpec {
  kind: 'boolean';
}
/** An object of known fields; keys it does not know are kept as they are. */
export interface ObjectSpec {
  kind: 'object';
  /** A name for the generated quick check and the schema's definitions. */
  name: string;
  fields: readonly Field[];
  /** More fields by the value of one of `fields` (a choice): checked after `fields`. */
  variant?: { on: string; cases: Readonly<Record<string, readonly Field[]>> };
}
/** An object whose keys come from a fixed list, each holding a number. */
export interface MapSpec {
  kind: 'map';
  keys: readonly string[];
  /** What a key names, for a message about a key not in the list: "a conductor material". */
  noun: string;
  value: NumberSpec;
}
/** A device's time–current curve: at least two [current A, time s] points, current rising and
 *  time falling. */
export interface PointsSpec {
  kind: 'points';
}
export type Spec = NumberSpec | TextSpec | ChoiceSpec | BooleanSpec | ObjectSpec | MapSpec | PointsSpec;

export interface Field {
  key: string;
  spec: Spec;
  required?: boolean;
  /** One line for the schema's description. */
  doc: string;
}

// Vocabularies (the app's pickers read these too).
export const MATERIALS = ['Cu', 'Al'] as const;
export const CURVES = ['B', 'C', 'D'] as const;
export const BASES = ['au-nz', 'iec'] as const;
export const MEASURED_RULES = ['temperature', 'fixed-factor'] as const;
export const NODE_KINDS = ['supply', 'board', 'point'] as const;
export const POINT_USES = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'] as const;
export const SOURCE_TYPES = ['unknown', 'impedance', 'fault-current'] as const;
export const INSULATIONS = ['pvc', 'xlpe'] as const;
export const DEVICE_TYPES = ['mcb', 'adjustable', 'curve', 'fixed'] as const;
export const DETAIL_KEYS = ['title', 'site', 'client', 'designer', 'reference', 'revision', 'date', 'notes'] as const;
export const PHASES = [1, 3] as const;

const num = (rule: NumberRule): NumberSpec => ({ kind: 'number', rule });
const text: TextSpec = { kind: 'text' };
const nonEmpty: TextSpec = { kind: 'text', nonEmpty: true };
const choice = (values: readonly (string | number)[]): ChoiceSpec => ({ kind: 'choice', values });
const bool: BooleanSpec = { kind: 'boolean' };
const field = (key: string, spec: Spec, doc: string, required = false): Field => (required ? { key, spec, doc, required } : { key, spec, doc });

export const DETAILS: ObjectSpec = {
  kind: 'object',
  name: 'details',
  fields: DETAIL_KEYS.map((key) => field(key, text, `the job's ${key} (title block)`)),
};

const resistivity = (): MapSpec => ({ kind: 'map', keys: MATERIALS, noun: 'a conductor material', value: num({ above: 0, max: 1 }) });

export const RULES: ObjectSpec = {
  kind: 'object',
  name: 'rules',
  fields: [
    field('basis', choice(BASES), 'the named set of defaults (absent: "au-nz")'),
    field('voltage', num({ above: 0, max: 1000 }), 'U0, nominal voltage to earth, V'),
    field('voltageFactor', num({ above: 0, max: 2 }), 'c, the voltage factor for the loop check'),
    field('unknownSourceShare', num({ above: 0, below: 1 }), 's, the share of the loop budget for the circuit when the source is unknown'),
    field('reactance', num({ min: 0, max: 0.01 }), 'reactance per conductor, Ω/m'),
    field('resistivity', resistivity(), 'resistivity at fault temperature by material, Ω·mm²/m'),
    field('voltageDropResistivity', resistivity(), 'resistivity for the voltage drop by material, Ω·mm²/m'),
    field('shortCircuitResistivity', resistivity(), 'resistivity for the maximum fault level by material, Ω·mm²/m'),
    field('voltageDropLimit', num({ above: 0, max: 100 }), 'voltage-drop limit, % of U0'),
    field('maxVoltageFactor', num({ above: 0, max: 2 }), 'cmax, the voltage factor for the maximum fault level'),
    field('measuredRule', choice(MEASURED_RULES), 'how readings are corrected'),
    field('measuredFactor', num({ above: 0, max: 1 }), 'the fixed factor for readings under "fixed-factor"'),
    field('multiples', { kind: 'map', keys: CURVES, noun: 'a breaker curve', value: num({ above: 0, max: 100 }) }, 'Ia / In by breaker curve'),
  ],
};

const AT: ObjectSpec = {
  kind: 'object',
  name: 'position',
  fields: [field('x', num({}), 'x on the sheet', true), field('y', num({}), 'y on the sheet', true)],
};

const SOURCE: ObjectSpec = {
  kind: 'object',
  name: 'source',
  fields: [field('type', choice(SOURCE_TYPES), 'how the source impedance is known', true)],
  variant: {
    on: 'type',
    cases: {
      unknown: [],
      impedance: [field('r', num({ min: 0 }), 'Ze resistance, Ω', true), field('x', num({ min: 0 }), 'Ze reactance, Ω', true)],
      'fault-current': [
        field('current', num({ above: 0 }), 'prospective earth-fault current at the supply, A', true),
        field('xr', num({ min: 0 }), 'X/R of the source (absent: 1)'),
      ],
    },
  },
};

export const NODE: ObjectSpec = {
  kind: 'object',
  name: 'node',
  fields: [
    field('id', nonEmpty, 'unique across nodes and links', true),
    field('kind', choice(NODE_KINDS), 'what the node is', true),
    field('name', text, 'a name for the drawing'),
    field('notes', text, 'free notes'),
    field('at', AT, 'where it is drawn'),
  ],
  variant: {
    on: 'kind',
    cases: {
      supply: [
        field('source', SOURCE, 'the source impedance Ze, or how it is known', true),
        field('phases', choice(PHASES), '1 or 3 (absent: from the points it feeds)'),
        field(
          'maxFault',
          {
            kind: 'object',
            name: 'maxFault',
            fields: [field('current', num({ above: 0 }), 'maximum prospective fault current, A', true), field('xr', num({ min: 0 }), 'X/R (absent: 1)')],
          },
          'the maximum prospective fault current at the supply',
        ),
        field(
          'measured',
          {
            kind: 'object',
            name: 'supplyReading',
            fields: [
              field('ze', num({ above: 0 }), 'measured Ze, Ω', true),
              field('date', text, 'when it was measured'),
              field('instrument', text, 'the instrument used'),
            ],
          },
          'a measured Ze',
        ),
      ],
      board: [field('diversity', num({ above: 0, max: 1 }), 'the diversity factor on the currents below it')],
      point: [
        field('use', choice(POINT_USES), 'what the final subcircuit supplies', true),
        field('handHeld', bool, 'supplies hand-held equipment'),
        field('current', num({ min: 0 }), 'the current drawn, A'),
        field('phases', choice(PHASES), '1 or 3'),
        field('powerFactor', num({ above: 0, max: 1 }), 'cos φ of the load'),
      ],
    },
  },
};

const CABLE: ObjectSpec = {
  kind: 'object',
  name: 'cable',
  fields: [
    field('length', num({ min: 0 }), 'route length, m', true),
    field('material', choice(MATERIALS), 'the actives\' metal', true),
    field('active', num({ above: 0 }), 'active conductor area, mm²', true),
    field('earth', num({ above: 0 }), 'protective earth conductor area, mm²', true),
    field('earthMaterial', choice(MATERIALS), 'the earth\'s metal (absent: as the actives)'),
    field('parallel', num({ min: 1, integer: true }), 'cables in parallel (absent: 1)'),
    field('reactance', num({ min: 0, max: 0.01 }), 'reactance per conductor, Ω/m (absent: the rules\')'),
    field('insulation', choice(INSULATIONS), 'insulation (absent: "pvc")'),
    field('earthInCable', bool, 'the earth runs in the cable (absent: true)'),
    field('capacity', num({ above: 0 }), 'current-carrying capacity Iz of the whole, as installed, A'),
    field('derating', num({ above: 0, max: 1 }), 'derating factor on the table capacity'),
  ],
};

const DEVICE: ObjectSpec = {
  kind: 'object',
  name: 'device',
  fields: [
    field('type', choice(DEVICE_TYPES), 'what kind of protective device', true),
    field('rating', num({ above: 0 }), 'rated current In, A', true),
    field('breaking', num({ above: 0 }), 'breaking capacity, kA'),
    field('letThrough', num({ above: 0 }), 'let-through energy I²t, A²s'),
    field('label', text, 'a label for the drawing'),
  ],
  variant: {
    on: 'type',
    cases: {
      mcb: [field('curve', choice(CURVES), 'the breaker curve', true)],
      adjustable: [
        field('instantaneous', num({ above: 0 }), 'instantaneous setting Ii, A', true),
        field('tolerance', num({ min: 0, below: 1 }), 'tolerance on Ii (absent: 0.2)'),
      ],
      curve: [field('points', { kind: 'points' }, '[current A, time s] pairs, current rising and time falling', true)],
      fixed: [field('tripCurrent', num({ above: 0 }), 'the current that disconnects in time, A', true)],
    },
  },
};

export const LINK: ObjectSpec = {
  kind: 'object',
  name: 'link',
  fields: [
    field('id', nonEmpty, 'unique across nodes and links', true),
    field('from', nonEmpty, 'the id of the node at its origin', true),
    field('to', nonEmpty, 'the id of the node it feeds', true),
    field('name', text, 'a name for the drawing'),
    field('notes', text, 'free notes'),
    field('requiredTime', num({ above: 0, max: 3600 }), 'required disconnection time, s (absent: by basis and use)'),
    field('phases', choice(PHASES), '1 or 3 (absent: derived)'),
    field('designCurrent', num({ above: 0 }), 'design current Ib, A (absent: from the loads below)'),
    field('powerFactor', num({ above: 0, max: 1 }), 'cos φ (absent: from the loads below)'),
    field('voltageDropLimit', num({ above: 0, max: 100 }), 'voltage-drop limit at its far end, %'),
    field(
      'measured',
      {
        kind: 'object',
        name: 'linkReading',
        fields: [
          field('zs', num({ above: 0 }), 'measured Zs at the far end, Ω', true),
          field('temperature', num({ min: -30, max: 60 }), 'conductor temperature at the test, °C'),
          field('date', text, 'when it was measured'),
          field('instrument', text, 'the instrument used'),
        ],
      },
      'a measured Zs',
    ),
    field('cable', CABLE, 'the cable', true),
    field('device', DEVICE, 'the protective device at its origin'),
    field('rcd', { kind: 'object', name: 'rcd', fields: [field('sensitivity', num({ above: 0, max: 10 }), 'rated residual current IΔn, A', true)] }, 'an RCD at its origin'),
  ],
};

/** The records the quick check is generated for. */
export const RECORDS = { details: DETAILS, rules: RULES, node: NODE, link: LINK } as const;
