// Node components for the single-line diagram: supply, board, point. Each is memoised and
// selects its own record by id, so an edit re-renders only the nodes it touched.
import { memo } from 'react';
import { Handle, Position, type NodeProps } from '@xyflow/react';
import { useEditor } from '../store/editor.js';
import { selectNode } from '../store/selectors.js';
import { sourceLine, USE_LABEL } from './labels.js';
import { NODE_SIZE } from './parts.js';

function useTraced(id: string): boolean {
  return useEditor((s) => s.highlightPath?.includes(id) ?? false);
}

function classes(kind: string, selected: boolean, traced: boolean): string {
  return `lw-node lw-node--${kind}${selected ? ' is-selected' : ''}${traced ? ' is-traced' : ''}`;
}

function SupplyNodeView({ id, selected }: NodeProps) {
  const node = useEditor(selectNode(id));
  const traced = useTraced(id);
  if (!node || node.kind !== 'supply') return null;
  return (
    <div className={classes('supply', selected, traced)} data-node-id={id} data-kind="supply" style={NODE_SIZE.supply}
      title={`${id}: ${node.name ?? 'supply'}`}>
      <svg className="lw-symbol" viewBox="0 0 32 32" aria-hidden="true">
        <circle cx="16" cy="16" r="13" />
        <path d="M8 16 q4 -7 8 0 t8 0" />
      </svg>
      <div className="lw-node-text">
        <div className="lw-node-title"><b>{id}</b> {node.name}</div>
        <div className="lw-node-sub">{sourceLine(node.source)}</div>
      </div>
      <Handle type="source" position={Position.Bottom} className="lw-handle lw-handle--out" />
    </div>
  );
}

function BoardNodeView({ id, selected }: NodeProps) {
  const node = useEditor(selectNode(id));
  const traced = useTraced(id);
  if (!node || node.kind !== 'board') return null;
  return (
    <div className={classes('board', selected, traced)} data-node-id={id} data-kind="board" style={NODE_SIZE.board}
      title={`${id}: ${node.name ?? 'board'}`}>
      <Handle type="target" position={Position.Top} className="lw-handle lw-handle--in" />
      <svg className="lw-symbol" viewBox="0 0 32 32" aria-hidden="true">
        <rect x="3" y="6" width="26" height="20" rx="1" />
        <path d="M7 12 H25 M10 12 V21 M16 12 V21 M22 12 V21" />
      </svg>
      <div className="lw-node-text">
        <div className="lw-node-title"><b>{id}</b></div>
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
