// The link: an orthogonal cable run with a label naming its device, its cable, its loop result,
// its load and drop and any measured reading, and its verdict by symbol, word and colour together
// (with the check that fails). The label keeps a readable size at any zoom: zoomed out it shows
// fewer lines, the verdict first; zoomed in every line. It never grows past the room above the
// node it feeds.
import { memo } from 'react';
import { BaseEdge, EdgeLabelRenderer, useStore, type EdgeProps, type ReactFlowState } from '@xyflow/react';
import { STATUS_READ, statusDescriptionId } from './flow.js';
import { useEditor } from '../store/editor.js';
import { selectLink, selectNode, selectResult } from '../store/selectors.js';
import { NODE_SIZE } from './parts.js';
import { BUS_DROP, LABEL_HEIGHT, linkGeometry, LABEL_WIDTH } from './geometry.js';
import { fitLabel, fitVerdict, labelLines, pickLines, shownVerdict, verdictText, CHAR_WIDTH, LABEL_LINE } from './labels.js';

/** The zoom in steps of 0.05, so a label re-renders only when its fit may change. */
const zoomStep = (s: ReactFlowState) => Math.max(0.05, Math.round(s.transform[2] * 20) / 20);

/** Height (flow px) a label may take where it is placed without reaching the feeding run or node. */
export function labelRoom(place: 'above-target' | 'beside-target' | 'middle', sy: number, ty: number): number {
  if (place !== 'above-target') return LABEL_HEIGHT;
  const busY = Math.min(sy + BUS_DROP, (sy + ty) / 2);
  // The label's foot is 6 px above the far node; keep 3 px clear of the bus run.
  return Math.max(LABEL_HEIGHT, ty - 6 - busY - 3);
}

function LinkEdgeView({ id, target, sourceX, sourceY, targetX, targetY, selected }: EdgeProps) {
  const link = useEditor(selectLink(id));
  const result = useEditor(selectResult(id));
  const traced = useEditor((s) => s.highlightPath?.includes(id) ?? false);
  const targetKind = useEditor((s) => selectNode(target)(s)?.kind);
  const zoom = useStore(zoomStep);
  if (!link) return null;
  const status = result?.status ?? 'unchecked';
  const verdict = result?.verdict ?? 'unchecked';
  const shown = shownVerdict(result);
  const g = linkGeometry(sourceX, sourceY, targetX, targetY, NODE_SIZE[targetKind ?? 'point'].width / 2);
  const cls = `lw-link lw-status--${shown}${selected ? ' is-selected' : ''}${traced ? ' is-traced' : ''}`;
  const transform =
    g.labelPlace === 'above-target'
      ? `translate(-50%, -100%) translate(${g.labelX}px, ${g.labelY}px)`
      : g.labelPlace === 'beside-target'
        ? `translate(0, -50%) translate(${g.labelX}px, ${g.labelY}px)`
        : `translate(-50%, -50%) translate(${g.labelX}px, ${g.labelY}px)`;
  const all = labelLines(link, result);
  const room = labelRoom(g.labelPlace, sourceY, targetY);
  const textWidth = LABEL_WIDTH - 16;
  // Zoomed in far enough, a long verdict ("design passes, reading fails") takes a second row.
  const long = verdictText(result);
  const wrapFit = fitLabel(all.length + 1, room, zoom);
  const wrap = wrapFit.count === all.length + 1 && long.length > textWidth / (CHAR_WIDTH * wrapFit.font)
    && long.length <= (2 * textWidth) / (CHAR_WIDTH * wrapFit.font);
  const fit = wrap ? { count: all.length, font: wrapFit.font } : fitLabel(all.length, room, zoom);
  const lines = pickLines(all, fit.count, result);
  // Zoomed out the device line may be left out: the id then leads the verdict line when it fits.
  const idOnDevice = lines.some((l) => l.key === 'device');
  const verdictFit = wrap ? { withId: false, text: long, font: fit.font } : fitVerdict(id, result, fit.font, textWidth, idOnDevice);
  const name = link.name ? `${link.name}: ` : '';
  const title = `${id} ${name}${all.map((l) => l.text).join('\n')}${result?.notes.length ? `\n${result.notes.join(' ')}` : ''}`;
  return (
    <>
      <g className={cls} data-link-id={id} data-status={status} data-verdict={verdict}>
        <desc id={statusDescriptionId(id)}>{STATUS_READ[status] ?? status}</desc>
        <BaseEdge id={id} path={g.path} interactionWidth={14} />
      </g>
      <EdgeLabelRenderer>
        <div
          className={`lw-link-label lw-status--${shown}${selected ? ' is-selected' : ''}${traced ? ' is-traced' : ''} nodrag nopan`}
          data-link-label={id}
          data-label-lines={lines.length}
          style={{ transform, maxWidth: LABEL_WIDTH, fontSize: `${fit.font.toFixed(2)}px`, lineHeight: LABEL_LINE }}
          title={title}
          onClick={() => useEditor.getState().select({ nodes: [], links: [id] })}
        >
          {lines.map((l) =>
            l.key === 'device' ? (
              <div key={l.key} className="lw-label-device" data-label-line="device"><b>{id}</b> {l.text}</div>
            ) : l.key === 'verdict' ? (
              <div key={l.key} className="lw-label-status" data-label-line="verdict"
                style={wrap ? { whiteSpace: 'normal' } : verdictFit.font < fit.font ? { fontSize: `${verdictFit.font.toFixed(2)}px` } : undefined}>
                {verdictFit.withId ? <b>{id} </b> : null}{verdictFit.text}
              </div>
            ) : (
              <div key={l.key} className={`lw-label-${l.key}`} data-label-line={l.key}>{l.text}</div>
            ),
          )}
        </div>
      </EdgeLabelRenderer>
    </>
  );
}

export const edgeTypes = { link: memo(LinkEdgeView) };
