// Joining parts: a new link from a feeding part to a part it feeds (dropped on the sheet, or
// chosen from the keyboard), and moving a link to another feeding part. Every refusal says why
// in the drawing's terms before the store's whole-job validation is asked.
import { defaultLinkFor } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { nextId } from '../store/ids.js';
import { feedReason, linkPrefix } from '../sheet/connect.js';

export type WireOutcome = { ok: true; id: string } | { ok: false; reason: string };

/** Adds a link from `from` to `to` with the role defaults, selects it; a refusal goes to the status bar. */
export function connectParts(from: string, to: string): WireOutcome {
  const s = useEditor.getState();
  const why = feedReason(s.job, from, to);
  if (why) {
    const reason = `Link from ${from} to ${to} refused: ${why}`;
    s.setMessage({ kind: 'error', text: reason });
    return { ok: false, reason };
  }
  const id = nextId(s.job, linkPrefix(s.job, from, to));
  const link = defaultLinkFor(s.job, from, to, id);
  const outcome = s.apply({ op: 'add-link', link }, `link ${from} → ${to}`);
  if (!outcome.ok) {
    const reason = `Link from ${from} to ${to} refused: ${outcome.reason}`;
    s.setMessage({ kind: 'error', text: reason });
    return { ok: false, reason };
  }
  s.select({ nodes: [], links: [id] });
  s.setMessage({ kind: 'info', text: `Linked ${from} → ${to} (${id})` });
  return { ok: true, id };
}

/** Re-points link `id` to be fed from `from` (the circuit moves to another board, nothing redrawn). */
export function moveFeed(id: string, from: string): { ok: true } | { ok: false; reason: string } {
  const s = useEditor.getState();
  const link = s.job.links.find((l) => l.id === id);
  if (!link) return { ok: false, reason: `There is no link ${id} any more` };
  if (link.from === from) return { ok: true };
  const why = feedReason(s.job, from, link.to, id);
  if (why) return { ok: false, reason: `${id} cannot be fed from ${from}: ${why}` };
  const outcome = s.apply({ op: 'update-link', id, patch: { from } }, `feed ${id} from ${from}`);
  return outcome.ok ? { ok: true } : { ok: false, reason: outcome.reason };
}
