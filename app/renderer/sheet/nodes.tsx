// Node components for the single-line diagram: supply, board, point. Each is memoised and
// selects its own record by id, so an edit re-renders only the nodes it touched.
import { memo } from 'react';
import { Handle, Position, type NodeProps } from '@xyflow/react';
import type { SupplyResult } from '../../../engine/index.js';
import { useEditor, type EditorState } from '../store/editor.js';
import { selectNode } from '../store/selectors.js';
import { faultLevelLine, headroomLine, sourceLine, USE_LABEL } from './labels.js';
import { NODE_SIZE } from './parts.js';

// Indexes of the results by node, rebuilt once per analysis (not once per node).
let indexedResults: EditorState['results'] | null = null;
let faultAt = new Map<string, number>();
let supplyById = new Map<string, SupplyResult>();
function indexResults(s: EditorState): void {
  if (s.results === indexedResults) return;
  indexedResults = s.results;
  faultAt = new Map();
  for (const c of s.results.circuits) if (c.faultLevel !== null && !faultAt.has(c.from)) faultAt.set(c.from, c.faultLevel);
  supplyById = new Map((s.results.supplies ?? []).map((r) => [r.node, r]));
}

/** Imax at a node: the fault level at the origin of the links leaving it (null when unknown). */
export function selectFaultAt(id: string) {
  return (s: EditorState): number | null => {
    indexResults(s);
    return faultAt.get(id) ?? null;
  };
}

export function selectSupplyResult(id: string) {
  return (s: EditorState): SupplyResult | undefined => {
    indexResults(s);
    return supplyById.get(id);
  };
}

function useTraced(id: string): boolean {
  return useEditor((s) => s.highlightPath?.includes(id) ?? false);
}

function classes(kind: string, selected: boolean, traced: boolean): string {
  return `lw-node lw-node--${kind}${selected ? ' is-selected' : ''}${traced ? ' is-traced' : ''}`;
}

function SupplyNodeView({ id, selected }: NodeProps) {
  const node = useEditor(selectNode(id));
  const traced = useTraced(id);
  const fault = useEditor((s) => selectSupplyResult(id)(s)?.faultLevel ?? null);
  const maxZe = useEditor((s) => selectSupplyResult(id)(s)?.maxZe ?? null);
  const minFault = useEditor((s) => selectSupplyResult(id)(s)?.minFaultCurrent ?? null);
  if (!node || node.kind !== 'supply') return null;
  const headroom = headroomLine(node.source, maxZe, minFault);
  const faultText = faultLevelLine(fault);
  const more = [faultText, headroom].filter((t) => t !== '').join(' · ');
  const headroomTitle = node.source.type === 'unknown' && minFault !== null
    ? `Ask the distributor for a prospective fault current of at least ${Math.ceil(minFault)} A (Ze at most ${maxZe?.toFixed(3)} Ω): the design passes for any source at least this strong.`
    : maxZe !== null ? `The design passes for a source impedance Ze up to ${maxZe.toFixed(3)} Ω.` : '';
  return (
    <div className={classes('supply', selected, traced)} data-node-id={id} data-kind="supply" style={NODE_SIZE.supply}
      title={`${id}: ${node.name ?? 'supply'}${faultText ? `\nMaximum prospective fault current ${faultText.replace('Imax ', '')}` : ''}${headroomTitle ? `\n${headroomTitle}` : ''}`}>
      <svg className="lw-symbol" viewBox="0 0 32 32" aria-hidden="true">
        <circle cx="16" cy="16" r="13" />
        <path d="M8 16 q4 -7 8 0 t8 0" />
      </svg>
      <div className="lw-node-text">
        <div className="lw-node-title"><b>{id}</b> {node.name}</div>
        <div className="lw-node-sub">{sourceLine(node.source)}</div>
        {more ? <div className="lw-node-sub" data-node-line="headroom">{more}</div> : null}
      </div>
      <Handle type="source" position={Position.Bottom} className="lw-handle lw-handle--out" />
    </div>
  );
}

function BoardNodeView({ id, selected }: NodeProps) {
  const node = useEditor(selectNode(id));
  const traced = useTraced(id);
  const fault = useEditor(selectFaultAt(id));
  if (!node || node.kind !== 'board') return null;
  const faultText = faultLevelLine(fault);
  return (
    <div className={classes('board', selected, traced)} data-node-id={id} data-kind="board" style={NODE_SIZE.board}
      title={`${id}: ${node.name ?? 'board'}${faultText ? `\nMaximum prospective fault current at the board ${faultText.replace('Imax ', '')}` : ''}`}>
      <Handle type="target" position={Position.Top} className="lw-handle lw-handle--in" />
      <svg className="lw-symbol" viewBox="0 0 32 32" aria-hidden="true">
        <rect x="3" y="6" width="26" height="20" rx="1" />
        <path d="M7 12 H25 M10 12 V21 M16 12 V21 M22 12 V21" />
      </svg>
      <div className="lw-node-text">
        <div className="lw-node-title"><b>{id}</b>{faultText ? <span className="lw-node-fault" data-node-line="fault"> {faultText}</span> : null}</div>
        <div className="lw-node-sub">{node.name}</div>
      </div>
      <Handle type="source" position={Position.Bottom} className="lw-handle lw-handle--out" />
    </div>
  );
}

function PointNodeView({ id, selected }: NodeProps) {
  const node = useEditor(selectNode(id));
  const traced = useTraced(id);
  if (!node || node.kind !== 'point') return null;
  return (
    <div className={classes('point', selected, traced)} data-node-id={id} data-kind="point" style={NODE_SIZE.point}
      title={`${id}: ${node.name ?? 'point'}`}>
      <Handle type="target" position={Position.Top} className="lw-handle lw-handle--in" />
      <svg className="lw-symbol lw-symbol--small" viewBox="0 0 32 32" aria-hidden="true">
        {node.use === 'lighting' ? (
          <><circle cx="16" cy="16" r="10" /><path d="M9 9 L23 23 M23 9 L9 23" /></>
        ) : node.use === 'motor' ? (
          <><circle cx="16" cy="16" r="11" /><text x="16" y="21" textAnchor="middle" fontSize="13">M</text></>
        ) : node.use === 'socket-outlets' ? (
          <><path d="M6 20 A10 10 0 0 1 26 20 Z" /><path d="M16 10 V4" /></>
        ) : (
          <rect x="7" y="7" width="18" height="18" />
        )}
      </svg>
      <div className="lw-node-text">
        <div className="lw-node-title"><b>{id}</b> {node.name}</div>
        <div className="lw-node-sub">{USE_LABEL[node.use] ?? node.use}{node.handHeld ? ', hand-held' : ''}</div>
      </div>
      <Handle type="source" position={Position.Bottom} className="lw-handle lw-handle--out" />
    </div>
  );
}

/** At module level, so React Flow never sees a new object. */
export const nodeTypes = {
  supply: memo(SupplyNodeView),
  board: memo(BoardNodeView),
  point: memo(PointNodeView),
};
