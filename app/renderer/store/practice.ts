// Values far outside what is built (a 1e9 m cable, a 0.01 mm² conductor): accepted, since the
// engine can check them, but shown with a warning beside the field, as they are most likely a
// typing slip. The bounds are common practice for low-voltage installations, deliberately wide.

interface Range {
  low?: number;
  high?: number;
  /** What the value is, for the warning. */
  what: string;
  unit: string;
}

// Common practice (no published source): the widest values met in LV design work.
const RANGES: Record<string, Range> = {
  'cable.length': { low: 0.1, high: 5000, what: 'a cable run', unit: 'm' },
  'cable.active': { low: 0.5, high: 1000, what: 'an active conductor', unit: 'mm²' },
  'cable.earth': { low: 0.5, high: 1000, what: 'an earth conductor', unit: 'mm²' },
  'cable.parallel': { high: 20, what: 'sets in parallel', unit: '' },
  'device.rating': { low: 0.5, high: 6300, what: 'a device rating', unit: 'A' },
  'rcd.sensitivity': { low: 0.006, high: 3, what: 'an RCD sensitivity', unit: 'A' },
  requiredTime: { low: 0.01, high: 5, what: 'a required disconnection time', unit: 's' },
  'source.r': { high: 5, what: 'a source resistance', unit: 'Ω' },
  'source.x': { high: 5, what: 'a source reactance', unit: 'Ω' },
  'source.current': { low: 50, high: 200_000, what: 'a prospective fault current', unit: 'A' },
};

function show(v: number, unit: string): string {
  const text = Math.abs(v) >= 1e6 || (v !== 0 && Math.abs(v) < 1e-3) ? v.toExponential(2) : String(Number(v.toPrecision(6)));
  return unit ? `${text} ${unit}` : text;
}

/** A warning for a stored value far outside practice, or null (also for no value or an unknown field). */
export function practiceWarning(field: string, value: number | undefined | null): string | null {
  const range = RANGES[field];
  if (!range || value === undefined || value === null || !Number.isFinite(value)) return null;
  if (field === 'cable.length' && value === 0) return null; // a zero-length tail is common in drawings
  if (range.low !== undefined && value < range.low) {
    return `${show(value, range.unit)} is far below practice for ${range.what} (under ${show(range.low, range.unit)}): check the value and its unit`;
  }
  if (range.high !== undefined && value > range.high) {
    return `${show(value, range.unit)} is far above practice for ${range.what} (over ${show(range.high, range.unit)}): check the value and its unit`;
  }
  return null;
}
