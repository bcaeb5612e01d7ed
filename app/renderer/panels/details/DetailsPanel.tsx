// The details panel: every field of the selected node or link, with the circuit's results.
// Several selected → how many, and how to delete them.

import { selectLink, selectNode, selectSelection, useEditor } from '../../store/index.js';
import { LinkDetails } from './LinkDetails.js';
import { NodeDetails } from './NodeDetails.js';

function SelectedLink({ id }: { id: string }) {
  const link = useEditor(selectLink(id));
  if (!link) return <p className="lwp-empty">Link {id} is no longer in the job.</p>;
  // Keyed by id so a newly selected link starts with fresh fields and no stale messages.
  return <LinkDetails key={id} link={link} />;
}

function SelectedNode({ id }: { id: string }) {
  const node = useEditor(selectNode(id));
  if (!node) return <p className="lwp-empty">Node {id} is no longer in the job.</p>;
  return <NodeDetails key={id} node={node} />;
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

export function DetailsPanel() {
  const selection = useEditor(selectSelection);
  const count = selection.nodes.length + selection.links.length;
  let body;
  if (count === 0) {
    body = <p className="lwp-empty">Select a supply, board, point or link on the sheet or in the schedule to see and edit its details.</p>;
  } else if (count > 1) {
    body = (
      <div className="lwp-multi" data-details-multi={count}>
        <p>
          <strong>{count} selected</strong> ({plural(selection.nodes.length, 'node')}, {plural(selection.links.length, 'link')}).
        </p>
        <p className="lwp-hint">Press Delete to remove them (a removed node takes its links with it); Undo brings them back. Select one to edit it.</p>
      </div>
    );
  } else if (selection.links[0] !== undefined) {
    body = <SelectedLink id={selection.links[0]} />;
  } else {
    body = <SelectedNode id={selection.nodes[0]!} />;
  }
  return (
    <section className="lwp-panel lwp-details" data-panel="details" aria-label="Details">
      <h2 className="lwp-panel-title">Details</h2>
      {body}
    </section>
  );
}
