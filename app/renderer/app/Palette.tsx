// Parts to place: drag onto the sheet, or click to add at the middle of the view.
import type { DragEvent } from 'react';
import type { NodeKind } from '../../../engine/index.js';
import { runCommand } from '../commands/context.js';
import { PART_MIME } from '../sheet/Sheet.js';
import { PART_HINT, PART_LABEL } from '../sheet/parts.js';

const KINDS: NodeKind[] = ['supply', 'board', 'point'];

export function Palette() {
  const start = (kind: NodeKind) => (e: DragEvent) => {
    e.dataTransfer.setData(PART_MIME, kind);
    e.dataTransfer.effectAllowed = 'copy';
  };
  return (
    <aside className="lw-palette" aria-label="Parts">
      <h2>Parts</h2>
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
      <p className="lw-hint">Connect parts by dragging from the dot under one to the dot on top of another.</p>
      <h2>Status</h2>
      <ul className="lw-legend">
        <li className="lw-status--pass">✓ pass</li>
        <li className="lw-status--fail">✗ FAIL</li>
        <li className="lw-status--rcd">⚠ RCD-reliant</li>
        <li className="lw-status--unchecked">○ unchecked</li>
      </ul>
    </aside>
  );
}
