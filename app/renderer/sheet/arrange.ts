// Auto-arrange: elkjs layered layout, top-down from each supply. Layers are spaced so that
// the link labels (placed just above each far node) have room.
import ELK from 'elkjs/lib/elk.bundled.js';
import type { ElkNode } from 'elkjs/lib/elk-api.js';
import type { Job } from '../../../engine/index.js';
import { LABEL_HEIGHT, LABEL_WIDTH } from './geometry.js';
import { NODE_SIZE } from './parts.js';

let elk: InstanceType<typeof ELK> | null = null;

export async function autoArrange(job: Job): Promise<Array<{ id: string; at: { x: number; y: number } }>> {
  elk ??= new ELK();
  const graph: ElkNode = {
    id: 'root',
    layoutOptions: {
      'elk.algorithm': 'layered',
      'elk.direction': 'DOWN',
      'elk.layered.spacing.nodeNodeBetweenLayers': String(LABEL_HEIGHT + 56),
      'elk.spacing.nodeNode': String(LABEL_WIDTH - NODE_SIZE.point.width + 28),
      'elk.spacing.componentComponent': '80',
      'elk.layered.nodePlacement.strategy': 'BRANDES_KOEPF',
      'elk.layered.crossingMinimization.semiInteractive': 'true',
      'elk.edgeRouting': 'ORTHOGONAL',
    },
    // Nodes as wide as their label so neighbours' labels never meet.
    children: job.nodes.map((n) => {
      const size = NODE_SIZE[n.kind];
      return {
        id: n.id,
        width: Math.max(size.width, LABEL_WIDTH),
        height: size.height,
        // Keeps the current left-to-right order where it can.
        layoutOptions: { 'elk.position': `(${n.at?.x ?? 0}, ${n.at?.y ?? 0})` },
      };
    }),
    edges: job.links.map((l) => ({ id: l.id, sources: [l.from], targets: [l.to] })),
  };
  const laid = await elk.layout(graph);
  return (laid.children ?? []).map((c) => {
    const node = job.nodes.find((n) => n.id === c.id)!;
    const size = NODE_SIZE[node.kind];
    const slot = Math.max(size.width, LABEL_WIDTH);
    return { id: c.id, at: { x: Math.round((c.x ?? 0) + (slot - size.width) / 2), y: Math.round(c.y ?? 0) } };
  });
}
