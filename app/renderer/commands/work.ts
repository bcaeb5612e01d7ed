// Commands for working through a job: add circuits to a board, connect from the keyboard, and
// walk the failing circuits one by one (outright failures first, then the RCD-reliant).
import { faultPath, type Results } from '../../../engine/index.js';
import type { EditorState } from '../store/editor.js';
import { useUi } from '../app/ui.js';
import type { Command, CommandContext } from './types.js';

const STATUS_WORDS = { fail: '✗ FAIL', rcd: '⚠ RCD-reliant' } as const;

/** The links to go through: verdict 'fail' first, then 'rcd', each in the order of the results. */
export function failingOrder(results: Results): Array<{ link: string; verdict: 'fail' | 'rcd' }> {
  const fails = results.circuits.filter((c) => c.verdict === 'fail').map((c) => ({ link: c.link, verdict: 'fail' as const }));
  const rcds = results.circuits.filter((c) => c.verdict === 'rcd').map((c) => ({ link: c.link, verdict: 'rcd' as const }));
  return [...fails, ...rcds];
}

/** The first circuit whose verdict is an outright failure, or null. */
export function firstFailure(results: Results): string | null {
  return results.circuits.find((c) => c.verdict === 'fail')?.link ?? null;
}

function step(ctx: CommandContext, direction: 1 | -1): void {
  const s = ctx.store.getState();
  const order = failingOrder(s.results);
  if (order.length === 0) {
    s.setMessage({ kind: 'info', text: 'No circuit fails or relies on an RCD' });
    return;
  }
  const current = s.selection.links.length === 1 ? order.findIndex((o) => o.link === s.selection.links[0]) : -1;
  const next = current < 0 ? (direction === 1 ? 0 : order.length - 1) : (current + direction + order.length) % order.length;
  const item = order[next]!;
  const found = faultPath(s.job, item.link);
  const path = found?.ids ?? [item.link];
  s.select({ nodes: [], links: [item.link] });
  s.setHighlight(path, item.link);
  ctx.sheet?.centre(path);
  const name = s.results.circuits.find((c) => c.link === item.link)?.name;
  const fails = order.filter((o) => o.verdict === 'fail').length;
  const where = item.verdict === 'fail' ? `failure ${next + 1} of ${fails}` : `RCD-reliant ${next - fails + 1} of ${order.length - fails}`;
  s.setMessage({ kind: 'info', text: `${STATUS_WORDS[item.verdict]} ${item.link}${name ? ` (${name})` : ''}: ${where}` });
}

const oneBoard = (s: EditorState) =>
  s.selection.links.length === 0 && s.selection.nodes.length === 1 && s.job.nodes.some((n) => n.id === s.selection.nodes[0] && n.kind === 'board');
const oneNode = (s: EditorState) => s.selection.links.length === 0 && s.selection.nodes.length === 1;

export const WORK_COMMANDS: Command[] = [
  {
    id: 'insert.circuits', label: 'Add Circuits to Board…', shortcut: 'Alt+C', group: 'arrange', contextMenu: true, enabled: oneBoard,
    run: (ctx) => {
      const board = ctx.store.getState().selection.nodes[0];
      if (board) useUi.getState().set({ addCircuits: board });
    },
  },
  {
    id: 'edit.connectTo', label: 'Connect To…', shortcut: 'Alt+L', group: 'arrange', contextMenu: true, enabled: oneNode,
    run: (ctx) => {
      const from = ctx.store.getState().selection.nodes[0];
      if (from) useUi.getState().set({ connectFrom: from });
    },
  },
  {
    id: 'view.nextFailing', label: 'Next Failing Circuit', shortcut: 'F8', group: 'view', toolbar: 'Next failing', separatorBefore: true,
    enabled: (s) => s.results.circuits.some((c) => c.verdict === 'fail' || c.verdict === 'rcd'), run: (ctx) => step(ctx, 1),
  },
  {
    id: 'view.previousFailing', label: 'Previous Failing Circuit', shortcut: 'Shift+F8', group: 'view',
    enabled: (s) => s.results.circuits.some((c) => c.verdict === 'fail' || c.verdict === 'rcd'), run: (ctx) => step(ctx, -1),
  },
];
