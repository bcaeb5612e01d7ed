// The link: an orthogonal cable run with a label naming its device, its cable and its result,
// and its status by symbol, word and colour together.
import { memo } from 'react';
import { BaseEdge, EdgeLabelRenderer, type EdgeProps } from '@xyflow/react';
import { useEditor } from '../store/editor.js';
import { selectLink, selectNode, selectResult } from '../store/selectors.js';
import { NODE_SIZE } from './parts.js';
import { linkGeometry, LABEL_WIDTH } from './geometry.js';
import { cableLine, deviceLine, resultLine, statusText } from './labels.js';

function LinkEdgeView({ id, target, sourceX, sourceY, targetX, targetY, selected }: EdgeProps) {
  const link = useEditor(selectLink(id));
  const result = useEditor(selectResult(id));
  const traced = useEditor((s) => s.highlightPath?.includes(id) ?? false);
  const targetKind = useEditor((s) => selectNode(target)(s)?.kind);
  if (!link) return null;
  const status = result?.status ?? 'unchecked';
  const g = linkGeometry(sourceX, sourceY, targetX, targetY, NODE_SIZE[targetKind ?? 'point'].width / 2);
  const cls = `lw-link lw-status--${status}${selected ? ' is-selected' : ''}${traced ? ' is-traced' : ''}`;
  const transform =
    g.labelPlace === 'above-target'
      ? `translate(-50%, -100%) translate(${g.labelX}px, ${g.labelY}px)`
      : g.labelPlace === 'beside-target'
        ? `translate(0, -50%) translate(${g.labelX}px, ${g.labelY}px)`
        : `translate(-50%, -50%) translate(${g.labelX}px, ${g.labelY}px)`;
  const name = link.name ? `${link.name}: ` : '';
  return (
    <>
      <g className={cls} data-link-id={id} data-status={status}>
        <BaseEdge id={id} path={g.path} interactionWidth={14} />
      </g>
      <EdgeLabelRenderer>
        <div
          className={`lw-link-label lw-status--${status}${selected ? ' is-selected' : ''}${traced ? ' is-traced' : ''} nodrag nopan`}
          data-link-label={id}
          style={{ transform, maxWidth: LABEL_WIDTH }}
          title={`${name}${result?.notes.join(' ') ?? ''}`}
          onClick={() => useEditor.getState().select({ nodes: [], links: [id] })}
        >
          <div className="lw-label-device"><b>{id}</b> {deviceLine(link, result)}</div>
          <div className="lw-label-cable">{cableLine(link)}</div>
          {resultLine(result) && <div className="lw-label-result">{resultLine(result)}</div>}
          <div className="lw-label-status">{statusText(status)}</div>
        </div>
      </EdgeLabelRenderer>
    </>
  );
}

export const edgeTypes = { link: memo(LinkEdgeView) };
