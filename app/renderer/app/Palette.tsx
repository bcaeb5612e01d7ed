// Parts to place: drag onto the sheet, or click to add at the middle of the view.
import type { DragEvent } from 'react';
import type { NodeKind } from '../../../engine/index.js';
import { runCommand } from '../commands/context.js';
import { PART_MIME } from '../sheet/Sheet.js';
import { PART_HINT, PART_LABEL } from '../sheet/parts.js';
import { Legend } from './Legend.js';
import { useUi } from './ui.js';

const KINDS: NodeKind[] = ['supply', 'board', 'point'];

export function Palette() {
  const start = (kind: NodeKind) => (e: DragEvent) => {
    e.dataTransfer.setData(PART_MIME, kind);
    e.dataTransfer.effectAllowed = 'copy';
  };
  return (
    <aside className="lw-palette" aria-label="Parts">
      <div className="lw-palette-head">
        <h2>Parts</h2>
        <button type="button" className="lw-fold" data-action="fold-palette" aria-expanded="true" aria-label="Fold the parts column"
          title="Fold the parts and legend away" onClick={() => useUi.getState().setLayout({ paletteCollapsed: true })}>◀</button>
      </div>
      {KINDS.map((kind) => (
        <button
          key={kind}
          type="button"
          draggable
          className={`lw-part lw-part--${kind}`}
          data-part={kind}
          title={`${PART_HINT[kind]}. Drag onto the sheet, or click to add.`}
          onDragStart={start(kind)}
          onClick={() => runCommand(`insert.${kind}`)}
        >
          <span className="lw-part-icon" aria-hidden="true" />
          {PART_LABEL[kind]}
        </button>
      ))}
      <p className="lw-hint">Connect parts by dragging from the dot under one and releasing on the other; or select one and press Alt+L (Connect To…).</p>
      <h2>Legend</h2>
      <Legend compact />
      <button type="button" className="lw-link-button" data-action="open-legend" title="The legend in full, with the caution and the keyboard (F1)"
        onClick={() => useUi.getState().set({ aboutOpen: true })}>
        Full legend and keys…
      </button>
    </aside>
  );
}
