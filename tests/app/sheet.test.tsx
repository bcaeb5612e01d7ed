import { beforeEach, describe, expect, it } from 'vitest';
import { act, render } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { ReactFlowProvider } from '@xyflow/react';
import { analyse, parseJob } from '../../engine/index.js';
import { Sheet } from '../../app/renderer/sheet/Sheet.js';
import { cableLine, resultLine, statusText } from '../../app/renderer/sheet/labels.js';
import { flowList, sameEdge, sheetDecor, toFlowEdge } from '../../app/renderer/sheet/flow.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { smallJob } from './fixture.js';

function renderSheet() {
  return render(
    <ReactFlowProvider>
      <div style={{ width: 1000, height: 800 }}><Sheet onContextMenu={() => undefined} /></div>
    </ReactFlowProvider>,
  );
}

describe('the sheet', () => {
  beforeEach(() => useEditor.getState().loadJob(smallJob(), { name: 'test.lwj' }));

  it('draws every node with data-node-id and every link with data-link-id and the results status', () => {
    const { container } = renderSheet();
    const nodeIds = [...container.querySelectorAll('[data-node-id]')].map((e) => e.getAttribute('data-node-id')).sort();
    expect(nodeIds).toEqual(['MSB', 'P1', 'P2', 'S1']);
    const results = analyse(useEditor.getState().job);
    const drawn = Object.fromEntries([...container.querySelectorAll('[data-link-id]')].map((e) => [e.getAttribute('data-link-id'), e.getAttribute('data-status')]));
    expect(drawn).toEqual(Object.fromEntries(results.circuits.map((c) => [c.link, c.status])));
  });

  it('updates a link status when an edit changes its result, and back after undo', () => {
    const { container } = renderSheet();
    const status = () => container.querySelector('[data-link-id="C1"]')?.getAttribute('data-status');
    expect(status()).toBe('pass');
    act(() => {
      useEditor.getState().apply({ op: 'update-link', id: 'C1', patch: { cable: { length: 300, material: 'Cu', active: 2.5, earth: 2.5 } } });
    });
    expect(status()).toBe('fail');
    expect(container.querySelector('[data-link-label="C1"]')?.textContent).toContain('✗ FAIL');
    act(() => useEditor.getState().undo());
    expect(status()).toBe('pass');
  });

  it('reads a link out by its label (id, ends) and its status as its description, which follows an edit', () => {
    const { container } = renderSheet();
    const edge = container.querySelector('.react-flow__edge[data-id="C1"]') ?? container.querySelector('[data-testid="rf__edge-C1"]');
    expect(edge?.getAttribute('aria-label')).toMatch(/^Link C1( ".*")?, MSB to P1$/);
    const described = () => container.querySelector(`[id="${edge!.getAttribute('aria-describedby')}"]`)?.textContent;
    expect(described()).toBe('✓ pass');
    act(() => {
      useEditor.getState().apply({ op: 'update-link', id: 'C1', patch: { cable: { length: 300, material: 'Cu', active: 2.5, earth: 2.5 } } });
    });
    expect(described()).toBe('✗ FAIL');
  });

  it('leaves React Flow the same edges list after a cable edit, even one that changes a status', () => {
    const job = useEditor.getState().job;
    const list = flowList(toFlowEdge, sameEdge);
    const before = list(job.links, [], sheetDecor(job, useEditor.getState().resultById));
    act(() => {
      useEditor.getState().apply({ op: 'update-link', id: 'C1', patch: { cable: { length: 300, material: 'Cu', active: 2.5, earth: 2.5 } } });
    });
    const after = useEditor.getState();
    expect(after.resultById.C1?.status).toBe('fail');
    expect(after.job.links).not.toBe(job.links);
    expect(list(after.job.links, [], sheetDecor(after.job, after.resultById))).toBe(before);
    // A new name reads out differently: a new edge.
    act(() => void useEditor.getState().apply({ op: 'update-link', id: 'C1', patch: { name: 'Renamed' } }));
    const renamed = useEditor.getState();
    const next = list(renamed.job.links, [], sheetDecor(renamed.job, renamed.resultById));
    expect(next).not.toBe(before);
    expect(next.find((e) => e.id === 'C1')?.ariaLabel).toContain('"Renamed"');
  });

  it('labels each link with device, cable, result and status by symbol and word', () => {
    const { container } = renderSheet();
    const label = container.querySelector('[data-link-label="C1"]')?.textContent ?? '';
    expect(label).toContain('C20');
    expect(label).toContain('2.5/2.5 Cu, 20 m');
    expect(label).toMatch(/own \d+\.\d\d \/ \d+\.\d\d Ω, \d+ %/);
    expect(label).toContain('✓ pass');
  });

  it('draws the demo job with the statuses of the results document', () => {
    const loaded = parseJob(readFileSync(resolve(process.cwd(), 'assets/demo.lwj'), 'utf8'));
    if (!loaded.ok) throw new Error('demo did not load');
    useEditor.getState().loadJob(loaded.job);
    const { container } = renderSheet();
    const results = analyse(loaded.job);
    const drawn = [...container.querySelectorAll('[data-link-id]')];
    expect(drawn).toHaveLength(results.circuits.length);
    for (const c of results.circuits) {
      expect(container.querySelector(`[data-link-id="${c.link}"]`)?.getAttribute('data-status'), c.link).toBe(c.status);
    }
  });
});

describe('label text', () => {
  it('formats cable, known-source and unknown-source results, and every status', () => {
    expect(cableLine({ id: 'C1', from: 'A', to: 'B', cable: { length: 32, material: 'Cu', active: 2.5, earth: 2.5 } })).toBe('2.5/2.5 Cu, 32 m');
    const base = { link: 'C1', name: null, from: 'A', to: 'B', role: 'final-subcircuit' as const, protectedBy: 'C1', device: 'C20', tripCurrent: 150,
      requiredTime: 0.4, upstream: 0.1, faultCurrent: null, clearingTime: null, maxLength: 60, status: 'pass' as const, notes: [],
      phases: 1 as const, designCurrent: null, powerFactor: null, voltageDrop: null, voltageDropTotal: null, voltageDropLimit: null,
      voltageStatus: 'unchecked' as const, capacity: null, capacityStatus: 'unchecked' as const, faultLevel: null,
      breakingStatus: 'unchecked' as const, earthMinArea: null, withstandStatus: 'unchecked' as const, testLimit: null,
      measured: null, fixes: [], verdict: 'pass' as const };
    expect(resultLine({ ...base, method: 'known-source', zs: 0.8412, own: 0.6, limit: 1.5333, ratio: 0.5486 })).toBe('Zs 0.84 / 1.53 Ω, 55 %');
    expect(resultLine({ ...base, method: 'unknown-source', zs: null, own: 0.576, limit: 1.2267, ratio: 0.4696 })).toBe('own 0.58 / 1.23 Ω, 47 %');
    expect(statusText('pass')).toBe('✓ pass');
    expect(statusText('fail')).toBe('✗ FAIL');
    expect(statusText('rcd')).toBe('⚠ RCD-reliant');
    expect(statusText('unchecked')).toBe('○ unchecked');
  });
});
