// Text on the drawing: device mark, cable, result and status. Status is always given by a
// symbol and a word as well as a colour.
import type { CircuitResult, Link, Source, Status } from '../../../engine/index.js';

export const STATUS_SYMBOL: Record<Status, string> = { pass: '✓', fail: '✗', rcd: '⚠', unchecked: '○' };
export const STATUS_WORD: Record<Status, string> = { pass: 'pass', fail: 'FAIL', rcd: 'RCD-reliant', unchecked: 'unchecked' };

/** Ohms for display: two decimals below 10 Ω, three significant figures above. */
export function ohms(v: number): string {
  return v < 10 ? v.toFixed(2) : v.toPrecision(3);
}

export function num(v: number): string {
  return Number.isInteger(v) ? String(v) : String(Number(v.toFixed(2)));
}

export function rcdMark(link: Link): string | null {
  if (!link.rcd) return null;
  const mA = link.rcd.sensitivity * 1000;
  return `RCD ${num(mA)} mA`;
}

export function deviceLine(link: Link, result: CircuitResult | undefined): string {
  const parts: string[] = [];
  if (link.device) parts.push(result?.device ?? link.device.label ?? `${link.device.rating} A`);
  const rcd = rcdMark(link);
  if (rcd) parts.push(rcd);
  if (parts.length > 0) return parts.join(' · ');
  if (result?.protectedBy && result.protectedBy !== link.id) return `via ${result.protectedBy}`;
  return 'no device';
}

export function cableLine(link: Link): string {
  const c = link.cable;
  const sets = c.parallel && c.parallel > 1 ? `${c.parallel}× ` : '';
  const earthMat = c.earthMaterial && c.earthMaterial !== c.material ? ` ${c.earthMaterial}` : '';
  return `${sets}${num(c.active)}/${num(c.earth)}${earthMat} ${c.material}, ${num(c.length)} m`;
}

export function resultLine(r: CircuitResult | undefined): string {
  if (!r) return '';
  const pct = r.ratio !== null ? `, ${Math.round(r.ratio * 100)} %` : '';
  if (r.method === 'known-source' && r.zs !== null) {
    return r.limit !== null ? `Zs ${ohms(r.zs)} / ${ohms(r.limit)} Ω${pct}` : `Zs ${ohms(r.zs)} Ω`;
  }
  if (r.method === 'unknown-source' && r.own !== null) {
    return r.limit !== null ? `own ${ohms(r.own)} / ${ohms(r.limit)} Ω${pct}` : `own ${ohms(r.own)} Ω`;
  }
  return r.method === null ? 'no supply' : '';
}

export function statusText(status: Status): string {
  return `${STATUS_SYMBOL[status]} ${STATUS_WORD[status]}`;
}

export function sourceLine(source: Source): string {
  switch (source.type) {
    case 'unknown':
      return 'Ze unknown (80 % rule)';
    case 'impedance':
      return `Ze ${ohms(Math.hypot(source.r, source.x))} Ω`;
    case 'fault-current': {
      const kA = source.current / 1000;
      return `Ipf ${num(kA)} kA${source.xr !== undefined ? `, X/R ${num(source.xr)}` : ''}`;
    }
  }
}

export const USE_LABEL: Record<string, string> = {
  'socket-outlets': 'socket-outlets',
  lighting: 'lighting',
  'fixed-equipment': 'fixed equipment',
  motor: 'motor',
  other: 'other',
};
