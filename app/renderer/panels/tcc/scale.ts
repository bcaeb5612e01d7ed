// Logarithmic axes for the time–current view: a value maps by its log10 between the decades
// that bound the domain.

export interface LogAxis {
  /** Domain, whole decades: lo = 10^a, hi = 10^b, a < b. */
  lo: number;
  hi: number;
  /** Range in drawing units (may run backwards, e.g. time upwards). */
  from: number;
  to: number;
}

export function logPosition(axis: LogAxis, value: number): number {
  const f = (Math.log10(value) - Math.log10(axis.lo)) / (Math.log10(axis.hi) - Math.log10(axis.lo));
  return axis.from + f * (axis.to - axis.from);
}

/** The whole decades 10^k from lo to hi inclusive. */
export function decades(lo: number, hi: number): number[] {
  const out: number[] = [];
  for (let k = Math.round(Math.log10(lo)); k <= Math.round(Math.log10(hi)); k++) out.push(10 ** k);
  return out;
}

/** The decade domain that holds every value (positive, finite), at least `min` decades wide. */
export function decadeDomain(values: readonly number[], min = 2): { lo: number; hi: number } {
  const good = values.filter((v) => Number.isFinite(v) && v > 0);
  if (good.length === 0) return { lo: 1, hi: 10 ** min };
  let a = Math.floor(Math.log10(Math.min(...good)));
  let b = Math.ceil(Math.log10(Math.max(...good)));
  while (b - a < min) {
    b += 1;
    if (b - a < min) a -= 1;
  }
  return { lo: 10 ** a, hi: 10 ** b };
}

/** A decade's label: 0.01, 0.1, 1, 10, 100, 1k, 10k … */
export function decadeLabel(v: number): string {
  if (v >= 1000) return `${v / 1000}k`;
  return String(Number(v.toPrecision(3)));
}
