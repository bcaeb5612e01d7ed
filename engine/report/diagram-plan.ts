// Where the diagram goes: node positions (the user's, or a layered layout of our own), the
// scale, and the split over sheets. Annotation text has a fixed size on paper; the scale has a
// floor at which no two nodes' annotation blocks overlap. When the drawing does not fit one
// sheet at that floor, it is split into tiles, one sheet each, rather than shrunk.

import type { Job } from '../model/types.js';
import type { Box } from './paper.js';

/** A node's annotation block relative to its centre, mm (y down): the incoming link's label
 *  above and to the right, the node's own name to the right. */
export const BLOCK = { left: -6, right: 31, top: -21, bottom: 7.2 };
/** The bus a parent's outgoing links hang from, below the parent's centre, mm. */
export const BUS = 9;
const PAD = 1;
/** Largest scale, mm on paper per drawing unit: small jobs are not blown up further. */
const MAX_SCALE = 0.35;
/** Scale ceiling for the no-overlap floor, so stacked nodes cannot demand endless sheets. */
const FLOOR_CAP = 2;
/** Spacing of the automatic layout, drawing units (as the editor's). */
const AUTO_DX = 200;
const AUTO_DY = 170;

export interface Tile {
  col: number;
  row: number;
  /** Anchor range of the tile in world mm. */
  x0: number;
  y0: number;
  w: number;
  h: number;
  /** Offset added to a world position to place it on the sheet. */
  dx: number;
  dy: number;
  nodes: string[];
}

export interface DiagramPlan {
  scale: number;
  auto: boolean;
  /** World positions in mm (drawing units × scale). */
  pos: Map<string, { x: number; y: number }>;
  tiles: Tile[];
  tileOf: Map<string, number>;
  area: Box;
}

/** A simple layered top-down layout: leaves side by side in tree order, parents centred. */
export function autoPositions(job: Job): Map<string, { x: number; y: number }> {
  const children = new Map<string, string[]>();
  const fed = new Set<string>();
  for (const l of job.links) {
    fed.add(l.to);
    const list = children.get(l.from) ?? [];
    list.push(l.to);
    children.set(l.from, list);
  }
  const pos = new Map<string, { x: number; y: number }>();
  let slot = 0;
  // Depth first without recursion (a chain of boards may be tens of thousands deep): a node is
  // placed when it is left, centred over its first and last child.
  const place = (root: string, rootDepth: number): void => {
    if (pos.has(root)) return;
    const stack: Array<{ id: string; depth: number; kids: string[]; next: number }> = [];
    const enter = (id: string, depth: number) => {
      pos.set(id, { x: 0, y: depth * AUTO_DY });
      stack.push({ id, depth, kids: (children.get(id) ?? []).filter((k) => !pos.has(k)), next: 0 });
    };
    enter(root, rootDepth);
    while (stack.length) {
      const top = stack[stack.length - 1]!;
      if (top.next < top.kids.length) {
        const kid = top.kids[top.next++]!;
        if (!pos.has(kid)) enter(kid, top.depth + 1);
        continue;
      }
      stack.pop();
      const x = top.kids.length === 0 ? slot++ * AUTO_DX : ((pos.get(top.kids[0]!)?.x ?? 0) + (pos.get(top.kids[top.kids.length - 1]!)?.x ?? 0)) / 2;
      pos.set(top.id, { x, y: top.depth * AUTO_DY });
    }
  };
  for (const n of job.nodes) if (!fed.has(n.id)) place(n.id, 0);
  for (const n of job.nodes) if (!pos.has(n.id)) place(n.id, 0); // safety: a loop cannot load
  return pos;
}

/** The smallest scale at which no two annotation blocks overlap. */
function overlapFloor(points: Array<{ x: number; y: number }>): number {
  const W = BLOCK.right - BLOCK.left + PAD;
  const H = BUS - BLOCK.top + PAD;
  let floor = 0;
  const sorted = [...points].sort((a, b) => a.x - b.x || a.y - b.y);
  // Points with the same x follow each other, sorted by y: within such a run only the next
  // point can set the floor (the nearest in y), so the rest of the run is skipped (a long chain
  // of boards drawn in one column stays linear).
  const runEnd = new Int32Array(sorted.length);
  for (let i = sorted.length - 1; i >= 0; i--) runEnd[i] = i + 1 < sorted.length && sorted[i + 1]!.x === sorted[i]!.x ? runEnd[i + 1]! : i + 1;
  for (let i = 0; i < sorted.length; i++) {
    const a = sorted[i];
    if (a === undefined) continue;
    for (let j = i + 1; j < sorted.length; j++) {
      if (j > i + 1 && j < runEnd[i]!) j = runEnd[i]!;
      if (j >= sorted.length) break;
      const b = sorted[j];
      if (b === undefined) continue;
      const dx = b.x - a.x;
      // Beyond this distance the pair needs less than the floor found so far.
      if (floor > 0 && dx * floor >= W) break;
      const dy = Math.abs(b.y - a.y);
      const need = Math.min(dx === 0 ? Infinity : W / dx, dy === 0 ? Infinity : H / dy);
      if (need > floor) floor = Math.min(need, FLOOR_CAP);
      if (floor >= FLOOR_CAP) return FLOOR_CAP;
    }
  }
  return floor;
}

export function planDiagram(job: Job, area: Box): DiagramPlan {
  const auto = job.nodes.some((n) => n.at === undefined);
  let raw = auto ? autoPositions(job) : new Map(job.nodes.map((n) => [n.id, n.at ?? { x: 0, y: 0 }]));
  let points = [...raw.values()];
  if (points.length === 0) return { scale: 1, auto, pos: new Map(), tiles: [], tileOf: new Map(), area };
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    minX = Math.min(minX, p.x);
    maxX = Math.max(maxX, p.x);
    minY = Math.min(minY, p.y);
    maxY = Math.max(maxY, p.y);
  }
  if (!Number.isFinite(maxX - minX) || !Number.isFinite(maxY - minY)) {
    // Positions so far apart that their span passes the largest number (near ±1.8e308): the same
    // drawing from the positions divided by 4, exactly (only their proportions are drawn).
    raw = new Map([...raw].map(([id, p]) => [id, { x: p.x / 4, y: p.y / 4 }]));
    points = [...raw.values()];
    minX /= 4;
    maxX /= 4;
    minY /= 4;
    maxY /= 4;
  }
  const spanX = maxX - minX;
  const spanY = maxY - minY;
  const cellW = area.w - (BLOCK.right - BLOCK.left) - 2 * PAD;
  const cellH = area.h - (BUS + 1 - BLOCK.top) - 2 * PAD;

  const floor = overlapFloor(points);
  const fit = Math.min(spanX > 0 ? cellW / spanX : Infinity, spanY > 0 ? cellH / spanY : Infinity);
  const scale = fit >= floor ? Math.min(fit, Math.max(MAX_SCALE, floor)) : floor;

  const pos = new Map<string, { x: number; y: number }>();
  for (const [id, p] of raw) pos.set(id, { x: (p.x - minX) * scale, y: (p.y - minY) * scale });
  const wx = spanX * scale;
  const wy = spanY * scale;
  // Bands packed greedily over the positions actually used, so no sheet starts in empty space.
  const xBands = bands([...pos.values()].map((p) => p.x), cellW);
  const yBands = bands([...pos.values()].map((p) => p.y), cellH);
  const cols = xBands.length;
  const rows = yBands.length;
  const grid = new Map<string, Tile>();
  for (const n of job.nodes) {
    const p = pos.get(n.id) ?? { x: 0, y: 0 };
    const col = bandOf(xBands, p.x);
    const row = bandOf(yBands, p.y);
    const key = `${row}:${col}`;
    let tile = grid.get(key);
    if (tile === undefined) {
      const x0 = xBands[col] ?? 0;
      const y0 = yBands[row] ?? 0;
      // A single tile is centred; split tiles start at the area's top left.
      const dx = cols === 1 ? area.x + (area.w - (wx + BLOCK.right - BLOCK.left)) / 2 - BLOCK.left - x0 : area.x + PAD - BLOCK.left - x0;
      const dy = rows === 1 ? area.y + (area.h - (wy + BUS + 1 - BLOCK.top)) / 2 - BLOCK.top - y0 : area.y + PAD - BLOCK.top - y0;
      tile = { col, row, x0, y0, w: cellW, h: cellH, dx, dy, nodes: [] };
      grid.set(key, tile);
    }
    tile.nodes.push(n.id);
  }
  const tiles = [...grid.values()].sort((a, b) => a.row - b.row || a.col - b.col);
  const tileOf = new Map<string, number>();
  tiles.forEach((t, i) => t.nodes.forEach((id) => tileOf.set(id, i)));
  return { scale, auto, pos, tiles, tileOf, area };
}

/** Band starts covering every value, each band at most `size` wide, packed from the smallest. */
function bands(values: number[], size: number): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  const starts: number[] = [];
  for (const v of sorted) {
    const last = starts[starts.length - 1];
    if (last === undefined || v - last > size + 1e-9) starts.push(v);
  }
  return starts;
}

function bandOf(starts: number[], v: number): number {
  let i = 0;
  while (i + 1 < starts.length && (starts[i + 1] ?? Infinity) <= v + 1e-9) i++;
  return i;
}
