// Find: search nodes and links by id or name; choosing one selects it and centres it.
import { useMemo, useState } from 'react';
import { useEditor } from '../store/editor.js';
import { selectSearchable, type Searchable } from '../store/selectors.js';
import { Dialog } from './Dialog.js';
import { useUi } from './ui.js';

interface Hit {
  id: string;
  kind: 'node' | 'link';
  text: string;
}

export function findHits(job: Searchable, query: string, limit = 50): Hit[] {
  const q = query.trim().toLowerCase();
  if (q === '') return [];
  const hits: Hit[] = [];
  const score = (id: string, name?: string) =>
    id.toLowerCase() === q ? 0 : id.toLowerCase().startsWith(q) ? 1 : id.toLowerCase().includes(q) || (name ?? '').toLowerCase().includes(q) ? 2 : -1;
  const ranked: Array<Hit & { score: number }> = [];
  for (const n of job.nodes) {
    const s = score(n.id, n.name);
    if (s >= 0) ranked.push({ id: n.id, kind: 'node', text: `${n.id} · ${n.kind} · ${n.name ?? ''}`, score: s });
  }
  for (const l of job.links) {
    const s = score(l.id, l.name);
    if (s >= 0) ranked.push({ id: l.id, kind: 'link', text: `${l.id} · link ${l.from} → ${l.to}${l.name ? ` · ${l.name}` : ''}`, score: s });
  }
  ranked.sort((a, b) => a.score - b.score);
  for (const r of ranked.slice(0, limit)) hits.push({ id: r.id, kind: r.kind, text: r.text });
  return hits;
}

export function FindDialog() {
  const open = useUi((s) => s.findOpen);
  if (!open) return null;
  return <FindBody />;
}

function FindBody() {
  const [query, setQuery] = useState('');
  // Only what Find searches, and only while there is a query: a drag or an edit of a cable does not re-run it.
  const searched = useEditor((s) => (query.trim() === '' ? null : selectSearchable(s)));
  const hits = useMemo(() => (searched ? findHits(searched, query) : []), [searched, query]);
  const close = () => useUi.getState().set({ findOpen: false });
  const choose = (hit: Hit) => {
    const s = useEditor.getState();
    s.select(hit.kind === 'node' ? { nodes: [hit.id], links: [] } : { nodes: [], links: [hit.id] });
    s.requestFocus([hit.id]);
    close();
  };
  return (
    <Dialog title="Find" onClose={close}>
      <input
        type="search"
        className="lw-find-input"
        placeholder="Name or id, e.g. C03 or kitchen"
        aria-label="Find by name or id"
        data-find
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        onKeyDown={(e) => {
          if (e.key === 'Enter' && hits[0]) choose(hits[0]);
        }}
      />
      <ul className="lw-find-hits">
        {hits.map((h) => (
          <li key={h.id}><button type="button" data-find-hit={h.id} onClick={() => choose(h)}>{h.text}</button></li>
        ))}
        {query.trim() !== '' && hits.length === 0 && <li className="lw-muted">Nothing matches “{query}”.</li>}
      </ul>
    </Dialog>
  );
}
