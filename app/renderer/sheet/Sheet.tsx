// The sheet: React Flow drawing the job. Nodes and links come from the store; every change the
// user makes on the sheet goes back through the store's apply(), so it is validated and undoable.
import { memo, useCallback, useEffect, useMemo, useRef, useState, type DragEvent, type FocusEvent as ReactFocusEvent, type MouseEvent as ReactMouseEvent } from 'react';
import {
  Background, BackgroundVariant, ConnectionLineType, MiniMap, ReactFlow, getViewportForBounds, useReactFlow, useStore,
  type Connection, type Edge, type EdgeChange, type Node, type NodeChange,
} from '@xyflow/react';
import type { NodeKind } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { connectParts } from '../commands/wiring.js';
import { edgeTypes } from './LinkEdge.js';
import { nodeTypes } from './nodes.js';
import { decorKeeper, flowList, sameEdge, toFlowEdge, toFlowNode } from './flow.js';
import { selectSearchable } from '../store/selectors.js';
import { getSheetHandle, setSheetHandle } from './handle.js';
import { NODE_SIZE, newPart } from './parts.js';
import { FIT_PADDING, MAP_BOX, PART_VIEW_NOTE, firstView, freeWidth, mapCorner, type MapCorner } from './view.js';
import { useUi } from '../app/ui.js';

export const PART_MIME = 'application/x-loopwright-part';
/** Above this many nodes only what is in view is drawn, and the view jumps rather than glides. */
export const LARGE = 1000;

// Props given to React Flow that never change: new ones on every render would re-render every
// drawn node and link wrapper (a drag frame re-renders the sheet).
const MULTI_SELECTION_KEYS = ['Meta', 'Control'];
const PRO_OPTIONS = { hideAttribution: true };

/** The part whose body is under a screen point, if any (a cable dropped there connects to it). */
export function partAt(x: number, y: number): string | null {
  if (typeof document.elementsFromPoint !== 'function') return null;
  for (const el of document.elementsFromPoint(x, y)) {
    const node = el.closest?.('.react-flow__node[data-id]');
    if (node) return node.getAttribute('data-id');
  }
  return null;
}

/**
 * A cable released without snapping to a dot: on a part's body it connects (from the part it was
 * drawn from, whichever dot it started at); anywhere else the status bar says how to connect.
 */
export function connectOnRelease(state: { isValid: boolean | null; fromNode: { id: string } | null; fromHandle: { type: string } | null }, at: { x: number; y: number }): void {
  if (state.isValid || !state.fromNode || !state.fromHandle) return;
  const onto = partAt(at.x, at.y);
  const start = state.fromNode.id;
  if (!onto || onto === start) {
    if (!onto) useEditor.getState().setMessage({ kind: 'info', text: `Not connected: release the cable from ${start} on a part to connect it` });
    return;
  }
  // From an output dot the cable feeds the part it is dropped on; from an input dot, the other way.
  if (state.fromHandle.type === 'source') connectParts(start, onto);
  else connectParts(onto, start);
}

// Positions dragged since the last frame, keyed by node id.
const pendingMoves = new Map<string, { id: string; at: { x: number; y: number } }>();
let pendingFrame: number | null = null;

function flushMoves(): void {
  if (pendingFrame !== null && typeof cancelAnimationFrame === 'function') cancelAnimationFrame(pendingFrame);
  pendingFrame = null;
  if (pendingMoves.size === 0) return;
  const moves = [...pendingMoves.values()];
  pendingMoves.clear();
  useEditor.getState().moveLive(moves);
}

/** After Fit the whole job is in view: the first view's "part of the job is out of view" goes. */
export function clearPartViewNote(): void {
  const s = useEditor.getState();
  const text = s.message?.text;
  if (!text || s.message?.kind !== 'info' || !text.toLowerCase().includes(PART_VIEW_NOTE.toLowerCase())) return;
  const rest = text.replace(` — ${PART_VIEW_NOTE}`, '').replace(PART_VIEW_NOTE.charAt(0).toUpperCase() + PART_VIEW_NOTE.slice(1), '').trim();
  s.setMessage(rest ? { kind: 'info', text: rest } : { kind: 'info', text: 'The whole job is in view' });
}

/**
 * Zoom out, the zoom level, zoom in and Fit, in a bar under the drawing rather than over it, so
 * they never cover a label; and the overview map shown or hidden.
 */
// Memoised: the sheet renders on every drag frame, the zoom bar only when the zoom or its props change.
const ZoomBar = memo(function ZoomBar({ map, onMap, placed }: { map: boolean; onMap(v: boolean): void; placed: boolean }) {
  const flow = useReactFlow();
  const zoom = useStore((st) => st.transform[2]);
  return (
    <div className="lw-zoombar" role="toolbar" aria-label="Zoom">
      <button type="button" data-zoom="out" aria-label="Zoom out" title="Zoom out" onClick={() => void flow.zoomOut({ duration: 150 })}>−</button>
      <span className="lw-zoom-level" data-zoom-level aria-live="polite">{Math.round(zoom * 100)} %</span>
      <button type="button" data-zoom="in" aria-label="Zoom in" title="Zoom in" onClick={() => void flow.zoomIn({ duration: 150 })}>+</button>
      <button type="button" data-zoom="fit" title="Zoom to Fit (Shift+1)" onClick={() => getSheetHandle()?.fit()}>Fit</button>
      <label className="lw-zoom-map"><input type="checkbox" checked={map} data-zoom="map" onChange={(e) => onMap(e.currentTarget.checked)} /> Overview map</label>
      {map && !placed && <span className="lw-muted" data-map-note>(left out here: every corner of the sheet has part of the drawing)</span>}
    </div>
  );
});

export interface SheetProps {
  onContextMenu(at: { x: number; y: number }): void;
}

export function Sheet({ onContextMenu }: SheetProps) {
  const jobNodes = useEditor((s) => s.job.nodes);
  const jobLinks = useEditor((s) => s.job.links);
  const selection = useEditor((s) => s.selection);
  const focus = useEditor((s) => s.focus);
  const flow = useReactFlow();
  const cursor = useRef<{ x: number; y: number } | null>(null);
  const wrapper = useRef<HTMLDivElement>(null);

  // Incremental: a drag frame replaces only the moved nodes; the links' array stays the same one.
  const nodeList = useMemo(() => flowList<(typeof jobNodes)[number], Node>(toFlowNode), []);
  const edgeList = useMemo(() => flowList<(typeof jobLinks)[number], Edge>(toFlowEdge, sameEdge), []);
  // Read-out names and the not-fed flag: rebuilt when an id, name, end or result changes, not on a drag frame.
  const searchable = useEditor(selectSearchable);
  const resultById = useEditor((s) => s.resultById);
  const decorOf = useMemo(() => decorKeeper(), []);
  const decor = useMemo(() => decorOf(searchable, resultById), [decorOf, searchable, resultById]);
  const nodes = nodeList(jobNodes, selection.nodes, decor);
  const edges = edgeList(jobLinks, selection.links, decor);

  const centre = useCallback(
    (ids: string[]) => {
      const job = useEditor.getState().job;
      const nodeIds = new Set<string>();
      for (const id of ids) {
        const link = job.links.find((l) => l.id === id);
        if (link) {
          nodeIds.add(link.from);
          nodeIds.add(link.to);
        } else nodeIds.add(id);
      }
      // On a large job every animation frame redraws what comes into view: jump instead.
      const duration = job.nodes.length > LARGE ? 0 : 250;
      if (nodeIds.size === 0) return;
      // A frame later the breakdown drawer this call may come with is drawn: frame the nodes in
      // the part of the sheet it leaves uncovered.
      requestAnimationFrame(() => {
        const sheet = wrapper.current?.getBoundingClientRect();
        const drawn = [...nodeIds].filter((id) => flow.getInternalNode(id));
        if (!sheet || sheet.width <= 0 || drawn.length === 0) return;
        // Only a drawer over the sheet covers part of it (docked beside the schedule it covers nothing).
        const box = document.querySelector('[data-breakdown-box]')?.getBoundingClientRect() ?? null;
        const drawer = box && box.top < sheet.bottom && box.bottom > sheet.top && box.left < sheet.right && box.right > sheet.left ? box : null;
        const width = freeWidth(sheet, drawer);
        const view = getViewportForBounds(flow.getNodesBounds(drawn), width, sheet.height, 0.05, 1.1, 0.3);
        void flow.setViewport(view, { duration });
      });
    },
    [flow],
  );

  useEffect(() => {
    setSheetHandle({
      fit: () => {
        void flow.fitView({ padding: FIT_PADDING, duration: useEditor.getState().job.nodes.length > LARGE ? 0 : 250 });
        clearPartViewNote();
      },
      centre,
      cursor: () => {
        if (cursor.current) return cursor.current;
        const box = wrapper.current?.getBoundingClientRect();
        return box ? flow.screenToFlowPosition({ x: box.left + box.width / 2, y: box.top + box.height / 2 }) : { x: 0, y: 0 };
      },
    });
    return () => setSheetHandle(null);
  }, [flow, centre]);

  useEffect(() => {
    if (focus) centre(focus.ids);
  }, [focus, centre]);

  // A link reached from the keyboard (Tab to it on the sheet, Enter on it, or a schedule row) is
  // brought into view when either end is off the sheet; a click leaves the view alone.
  const keyboard = useRef(false);
  useEffect(() => {
    const key = () => { keyboard.current = true; };
    const pointer = () => { keyboard.current = false; };
    window.addEventListener('keydown', key, true);
    window.addEventListener('pointerdown', pointer, true);
    return () => {
      window.removeEventListener('keydown', key, true);
      window.removeEventListener('pointerdown', pointer, true);
    };
  }, []);
  const ensureVisible = useCallback((id: string) => {
    const job = useEditor.getState().job;
    const link = job.links.find((l) => l.id === id);
    const box = wrapper.current?.getBoundingClientRect();
    if (!link || !box || box.width <= 0) return;
    const { x, y, zoom } = flow.getViewport();
    const ends = job.nodes.filter((n) => n.id === link.from || n.id === link.to);
    const off = ends.some((n) => {
      const at = n.at ?? { x: 0, y: 0 };
      const size = NODE_SIZE[n.kind];
      const left = at.x * zoom + x;
      const top = at.y * zoom + y;
      return left < 0 || top < 0 || left + size.width * zoom > box.width || top + size.height * zoom > box.height;
    });
    if (off) centre([id]);
  }, [flow, centre]);
  const selectedLinks = selection.links;
  useEffect(() => {
    if (keyboard.current && selectedLinks.length === 1) ensureVisible(selectedLinks[0]!);
  }, [selectedLinks, ensureVisible]);
  const onFocusCapture = useCallback((e: ReactFocusEvent) => {
    if (!keyboard.current) return;
    const edge = (e.target as Element).closest?.('.react-flow__edge[data-id]');
    const id = edge?.getAttribute('data-id');
    if (id) ensureVisible(id);
  }, [ensureVisible]);

  // A job just opened (or a new one started), and the first job on mount: the whole job when it
  // fits at a readable zoom, else the supply and the top of its tree, saying how to see it all.
  const documentSeq = useEditor((s) => s.documentSeq);
  useEffect(() => {
    const frame = requestAnimationFrame(() => {
      const box = wrapper.current?.getBoundingClientRect();
      const view = firstView(useEditor.getState().job.nodes, { width: box?.width ?? 0, height: box?.height ?? 0 });
      void flow.setViewport({ x: view.x, y: view.y, zoom: view.zoom });
      if (!view.whole) {
        const s = useEditor.getState();
        const note = PART_VIEW_NOTE.charAt(0).toUpperCase() + PART_VIEW_NOTE.slice(1);
        if (!s.message) s.setMessage({ kind: 'info', text: note });
        else if (s.message.kind === 'info' && !s.message.text.includes(PART_VIEW_NOTE)) s.setMessage({ kind: 'info', text: `${s.message.text} — ${PART_VIEW_NOTE}` });
      }
    });
    return () => cancelAnimationFrame(frame);
  }, [documentSeq, flow]);

  const onNodesChange = useCallback((changes: NodeChange[]) => {
    const s = useEditor.getState();
    const live: Array<{ id: string; at: { x: number; y: number } }> = [];
    let done = false;
    let sel: Set<string> | null = null;
    for (const c of changes) {
      if (c.type === 'position' && c.position) {
        live.push({ id: c.id, at: { x: Math.round(c.position.x), y: Math.round(c.position.y) } });
        if (!c.dragging) done = true;
      } else if (c.type === 'position' && c.dragging === false) {
        done = true;
      } else if (c.type === 'select') {
        sel ??= new Set(s.selection.nodes);
        if (c.selected) sel.add(c.id);
        else sel.delete(c.id);
      }
    }
    // Live positions reach the store at most once a frame; the drop flushes the last of them.
    for (const m of live) pendingMoves.set(m.id, m);
    if (live.length > 0 && !done) {
      if (typeof requestAnimationFrame === 'function') pendingFrame ??= requestAnimationFrame(flushMoves);
      else flushMoves();
    }
    if (done) {
      flushMoves();
      const job = useEditor.getState().job;
      const ids = new Set(changes.map((c) => ('id' in c ? c.id : '')));
      const moves = job.nodes.filter((n) => ids.has(n.id)).map((n) => ({ id: n.id, at: n.at ?? { x: 0, y: 0 } }));
      s.apply({ op: 'move', moves }, moves.length === 1 ? `move ${moves[0]!.id}` : `move ${moves.length} nodes`);
    }
    if (sel) s.select({ nodes: [...sel] });
  }, []);

  const onEdgesChange = useCallback((changes: EdgeChange[]) => {
    const s = useEditor.getState();
    let sel: Set<string> | null = null;
    for (const c of changes) {
      if (c.type === 'select') {
        sel ??= new Set(s.selection.links);
        if (c.selected) sel.add(c.id);
        else sel.delete(c.id);
      }
    }
    if (sel) s.select({ links: [...sel] });
  }, []);

  const onConnect = useCallback((c: Connection) => {
    if (!c.source || !c.target) return;
    connectParts(c.source, c.target);
  }, []);

  const onConnectEnd = useCallback((e: MouseEvent | TouchEvent, state: Parameters<typeof connectOnRelease>[0]) => {
    const point = 'changedTouches' in e ? e.changedTouches[0] : e;
    if (point) connectOnRelease(state, { x: point.clientX, y: point.clientY });
  }, []);

  const onMouseMove = useCallback((e: ReactMouseEvent) => {
    cursor.current = flow.screenToFlowPosition({ x: e.clientX, y: e.clientY });
  }, [flow]);
  // Off the sheet (say, clicking a part in the palette) new parts go to the middle of the view;
  // the spot of a right-click is kept while its context menu is open.
  const onMouseLeave = useCallback(() => {
    if (!useUi.getState().contextMenu) cursor.current = null;
  }, []);

  const onDragOver = useCallback((e: DragEvent) => {
    if (e.dataTransfer.types.includes(PART_MIME)) {
      e.preventDefault();
      e.dataTransfer.dropEffect = 'copy';
    }
  }, []);

  const onDrop = useCallback((e: DragEvent) => {
    const kind = e.dataTransfer.getData(PART_MIME) as NodeKind;
    if (kind !== 'supply' && kind !== 'board' && kind !== 'point') return;
    e.preventDefault();
    const s = useEditor.getState();
    const node = newPart(s.job, kind, flow.screenToFlowPosition({ x: e.clientX, y: e.clientY }));
    if (s.apply({ op: 'add-node', node }, `add ${kind}`).ok) s.select({ nodes: [node.id], links: [] });
  }, [flow]);

  const contextMenu = useCallback((e: ReactMouseEvent | MouseEvent) => {
    e.preventDefault();
    cursor.current = flow.screenToFlowPosition({ x: e.clientX, y: e.clientY });
    onContextMenu({ x: e.clientX, y: e.clientY });
  }, [flow, onContextMenu]);

  const onNodeContextMenu = useCallback((e: ReactMouseEvent, n: Node) => {
    if (!useEditor.getState().selection.nodes.includes(n.id)) useEditor.getState().select({ nodes: [n.id], links: [] });
    contextMenu(e);
  }, [contextMenu]);
  const onEdgeContextMenu = useCallback((e: ReactMouseEvent, ed: Edge) => {
    if (!useEditor.getState().selection.links.includes(ed.id)) useEditor.getState().select({ nodes: [], links: [ed.id] });
    contextMenu(e);
  }, [contextMenu]);

  // Above this size only what is in view is drawn (every link still has its result in the schedule).
  const large = jobNodes.length > LARGE;
  const map = useUi((u) => u.layout.minimap !== false);
  const setMap = useCallback((v: boolean) => useUi.getState().setLayout({ minimap: v }), []);
  // The overview map goes to a corner the drawing leaves empty, looked at after every pan or zoom
  // and every edit, and is left out when there is none: it never covers a node or a label.
  const [corner, setCorner] = useState<MapCorner | null>('top-right');
  const placeMap = useCallback(() => {
    const box = wrapper.current?.getBoundingClientRect();
    if (!box || box.width <= 0) return;
    const drawn = [...wrapper.current!.querySelectorAll('[data-node-id], [data-link-label]')].map((e) => {
      const r = e.getBoundingClientRect();
      return { left: r.left - box.left, top: r.top - box.top, right: r.right - box.left, bottom: r.bottom - box.top };
    }).filter((r) => r.right > r.left);
    setCorner(mapCorner(box, drawn));
  }, []);
  // A large job draws no minimap: nothing to place (measuring every label would cost an edit).
  useEffect(() => {
    if (large) return;
    const frame = requestAnimationFrame(placeMap);
    return () => cancelAnimationFrame(frame);
  }, [placeMap, searchable, resultById, documentSeq, large]);
  const onMoveEnd = useCallback(() => {
    if (!large) placeMap();
  }, [placeMap, large]);
  return (
    <div className="lw-sheet-frame">
    <div className="lw-sheet" ref={wrapper} onFocusCapture={onFocusCapture} onMouseMove={onMouseMove} onMouseLeave={onMouseLeave} onDragOver={onDragOver} onDrop={onDrop} data-sheet>
      <ReactFlow
        nodes={nodes}
        edges={edges}
        nodeTypes={nodeTypes}
        edgeTypes={edgeTypes}
        onNodesChange={onNodesChange}
        onEdgesChange={onEdgesChange}
        onConnect={onConnect}
        onConnectEnd={onConnectEnd}
        onPaneContextMenu={contextMenu}
        onNodeContextMenu={onNodeContextMenu}
        onEdgeContextMenu={onEdgeContextMenu}
        deleteKeyCode={null}
        selectionKeyCode="Shift"
        multiSelectionKeyCode={MULTI_SELECTION_KEYS}
        connectionLineType={ConnectionLineType.Step}
        connectionRadius={28}
        onlyRenderVisibleElements={large}
        onMoveEnd={onMoveEnd}
        onNodeDragStop={onMoveEnd}
        minZoom={0.05}
        maxZoom={3}
        proOptions={PRO_OPTIONS}
      >
        <Background variant={BackgroundVariant.Lines} gap={40} color="#e8ecf1" />
        {/* Top right: a tree drawn down from its supply leaves that corner empty, where the bottom right held its widest row. */}
        {!large && map && corner && <MiniMap position={corner} pannable zoomable nodeStrokeWidth={2} style={{ width: MAP_BOX.width, height: MAP_BOX.height }} />}
      </ReactFlow>
    </div>
    <ZoomBar map={map} onMap={setMap} placed={large || corner !== null} />
    </div>
  );
}
