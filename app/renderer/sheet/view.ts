// The first view of a job just opened: the whole job when it fits at a zoom where labels stay
// readable; otherwise the supply and the top of its tree at that zoom, the rest a scroll away.
import type { JobNode } from '../../../engine/index.js';
import { NODE_SIZE } from './parts.js';

/** Below this zoom the link labels (11 px type) are too small to read. */
export const READABLE_ZOOM = 0.6;
/** Fitting never enlarges a small job beyond this. */
export const FIT_MAX_ZOOM = 1;
/** Room left around the job, as a share of the view (the same as Fit). */
export const FIT_PADDING = 0.08;

export interface Viewport {
  x: number;
  y: number;
  zoom: number;
}

export interface FirstView extends Viewport {
  /** True when the whole job is in view. */
  whole: boolean;
}

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** The drawn extent of the nodes (sheet coordinates), or null for an empty job. */
export function jobBounds(nodes: readonly JobNode[]): Bounds | null {
  if (nodes.length === 0) return null;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const n of nodes) {
    const at = n.at ?? { x: 0, y: 0 };
    const size = NODE_SIZE[n.kind];
    minX = Math.min(minX, at.x);
    minY = Math.min(minY, at.y);
    maxX = Math.max(maxX, at.x + size.width);
    maxY = Math.max(maxY, at.y + size.height);
  }
  return { minX, minY, maxX, maxY };
}

/** The view to open a job with, in a sheet `box` pixels in size. */
export function firstView(nodes: readonly JobNode[], box: { width: number; height: number }): FirstView {
  const bounds = jobBounds(nodes);
  if (!bounds || box.width <= 0 || box.height <= 0) return { x: box.width / 2, y: 60, zoom: 1, whole: true };
  const w = Math.max(1, bounds.maxX - bounds.minX);
  const h = Math.max(1, bounds.maxY - bounds.minY);
  const fit = Math.min((box.width * (1 - 2 * FIT_PADDING)) / w, (box.height * (1 - 2 * FIT_PADDING)) / h);
  if (fit >= READABLE_ZOOM) {
    const zoom = Math.min(fit, FIT_MAX_ZOOM);
    return {
      x: box.width / 2 - ((bounds.minX + bounds.maxX) / 2) * zoom,
      y: box.height / 2 - ((bounds.minY + bounds.maxY) / 2) * zoom,
      zoom,
      whole: true,
    };
  }
  const zoom = READABLE_ZOOM;
  const padX = box.width * FIT_PADDING;
  const padY = box.height * FIT_PADDING;
  // The supply (else the highest node) is the anchor: the top of its tree is what matters first.
  const anchor = nodes.find((n) => n.kind === 'supply') ?? [...nodes].sort((a, b) => (a.at?.y ?? 0) - (b.at?.y ?? 0))[0]!;
  const anchorAt = anchor.at ?? { x: 0, y: 0 };
  const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
  // Across: centred on the anchor, but never past either edge of the job when it is wider than the view.
  const x = w * zoom <= box.width - 2 * padX
    ? box.width / 2 - ((bounds.minX + bounds.maxX) / 2) * zoom
    : clamp(box.width / 2 - (anchorAt.x + NODE_SIZE[anchor.kind].width / 2) * zoom, box.width - padX - bounds.maxX * zoom, padX - bounds.minX * zoom);
  // Down: the anchor at the top of the view, or the job centred when it is not that tall.
  const y = h * zoom <= box.height - 2 * padY
    ? box.height / 2 - ((bounds.minY + bounds.maxY) / 2) * zoom
    : clamp(padY - anchorAt.y * zoom, box.height - padY - bounds.maxY * zoom, padY - bounds.minY * zoom);
  return { x, y, zoom, whole: false };
}

/** What the status bar says when the first view shows only part of the job. */
export const PART_VIEW_NOTE = 'part of the job is out of view; Fit (Shift+1) shows all of it';

/** The smallest width worth framing into beside the breakdown drawer; below it the whole sheet is used. */
export const MIN_FREE_WIDTH = 240;

/**
 * The width of the sheet, from its left edge, that the loop breakdown drawer leaves uncovered, so
 * a traced path or a centred circuit is framed where it can be seen. `drawer` is the drawer's box
 * on screen (null when it is closed); a folded drawer (a short strip) covers nothing that matters.
 */
export function freeWidth(
  sheet: { left: number; width: number; top: number; height: number },
  drawer: { left: number; width: number; top: number; height: number } | null,
): number {
  if (!drawer || drawer.width <= 0 || drawer.height < sheet.height / 3) return sheet.width;
  const free = drawer.left - sheet.left - 8;
  return free >= MIN_FREE_WIDTH ? Math.min(free, sheet.width) : sheet.width;
}

/** The overview map's drawn size and its margin from the sheet's corner (px). */
export const MAP_BOX = { width: 150, height: 90, margin: 15 };

export type MapCorner = 'top-right' | 'top-left' | 'bottom-right';

interface Rect {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/**
 * The corner of the sheet where the overview map covers no drawn node or label, trying the top
 * right first (a tree drawn down from its supply leaves it empty); null when every corner is
 * taken, and the map is then left out rather than laid over the drawing.
 */
export function mapCorner(sheet: { width: number; height: number }, drawn: readonly Rect[], order: readonly MapCorner[] = ['top-right', 'top-left', 'bottom-right']): MapCorner | null {
  const { width, height, margin } = MAP_BOX;
  for (const corner of order) {
    const left = corner === 'top-left' ? margin : sheet.width - margin - width;
    const top = corner === 'bottom-right' ? sheet.height - margin - height : margin;
    const box = { left: left - 4, top: top - 4, right: left + width + 4, bottom: top + height + 4 };
    if (left < 0 || top < 0) continue;
    if (!drawn.some((r) => r.left < box.right && r.right > box.left && r.top < box.bottom && r.bottom > box.top)) return corner;
  }
  return null;
}
