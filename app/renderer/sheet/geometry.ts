// Where links run and where their labels sit. A link drops from the bottom of its feeding node
// to a short bus just below it, runs across, and drops into the top of the node it feeds; its
// label sits on that last drop, just above the node it feeds (one feeder per node, so one label
// per node and labels never share a place as long as nodes do not).

export const LABEL_WIDTH = 184;
export const LABEL_HEIGHT = 62;
/** How far below the feeding node the bus runs. */
export const BUS_DROP = 18;

export interface LinkGeometry {
  path: string;
  labelX: number;
  labelY: number;
  /** 'above-target'; 'beside-target' when there is no room above it; 'middle' when the far node is not below the feeder. */
  labelPlace: 'above-target' | 'beside-target' | 'middle';
}

/** `targetHalfWidth`: half the far node's drawn width (a label beside it clears the node). */
export function linkGeometry(sx: number, sy: number, tx: number, ty: number, targetHalfWidth = 80): LinkGeometry {
  if (ty - sy > 8) {
    const busY = Math.min(sy + BUS_DROP, (sy + ty) / 2);
    const path = `M ${sx},${sy} V ${busY} H ${tx} V ${ty}`;
    const roomy = ty - busY > LABEL_HEIGHT + 8;
    return roomy
      ? { path, labelX: tx, labelY: ty - 6, labelPlace: 'above-target' }
      : { path, labelX: tx + targetHalfWidth + 10, labelY: ty - 4, labelPlace: 'beside-target' };
  }
  // The far node is level with or above the feeder: go out and round.
  const midX = (sx + tx) / 2;
  const path = `M ${sx},${sy} V ${sy + BUS_DROP} H ${midX} V ${ty - BUS_DROP} H ${tx} V ${ty}`;
  return { path, labelX: midX, labelY: (sy + ty) / 2, labelPlace: 'middle' };
}
