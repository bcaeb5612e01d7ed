import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { BreakdownPanel, showBreakdown, useBreakdownFollowsSelection, useBreakdownView } from '../../../app/renderer/panels/index.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { load, sampleJob } from './fixture.js';

function segments(container: HTMLElement) {
  return [...container.querySelectorAll<HTMLElement>('[data-segment]')].map((el) => ({
    id: el.getAttribute('data-segment')!,
    kind: el.getAttribute('data-segment-kind'),
    upstream: el.getAttribute('data-upstream') === 'true',
    r: Number(el.getAttribute('data-r')),
    x: Number(el.getAttribute('data-x')),
    z: Number(el.getAttribute('data-z')),
    text: el.textContent ?? '',
  }));
}

describe('loop breakdown', () => {
  it('renders nothing until a breakdown is asked for', () => {
    load(sampleJob());
    const { container } = render(<BreakdownPanel />);
    expect(container.innerHTML).toBe('');
  });

  describe('with the source impedance known', () => {
    beforeEach(() => load(sampleJob('known')));

    it('shows the source, then each link from the supply; the segments sum to the total Zs', () => {
      const { container } = render(<BreakdownPanel />);
      act(() => showBreakdown('C1'));
      const segs = segments(container);
      expect(segs.map((s) => s.id)).toEqual(['S1', 'M1', 'C1']);
      expect(segs[0]).toMatchObject({ kind: 'source', r: 0.2, x: 0.1, upstream: true });
      expect(segs[1]!.upstream).toBe(true); // the consumer mains lies before C1's breaker
      expect(segs[2]!.upstream).toBe(false);
      // C1: 32 m of 2.5/2.5 mm² Cu, ρ = 0.0225 Ω·mm²/m (AS/NZS 3000:2018 clause B5.2.2):
      // R = 0.0225 × 32 / 2.5 × 2 = 0.576 Ω.
      expect(segs[2]!.r).toBeCloseTo(0.576, 6);
      const total = Number(container.querySelector('[data-breakdown-total]')!.getAttribute('data-breakdown-total'));
      const r = segs.reduce((a, s) => a + s.r, 0);
      const x = segs.reduce((a, s) => a + s.x, 0);
      expect(Math.hypot(r, x)).toBeCloseTo(total, 9);
      // The total is the Zs the results document gives for C1.
      const zs = useEditor.getState().resultById.C1!.zs!;
      expect(total).toBeCloseTo(zs, 9);
      expect(container.textContent).toContain(`${zs.toFixed(3)} Ω against limit`);
    });

    it('labels each bar in text with its ohms and share of the limit, and gives the verdict', () => {
      const { container } = render(<BreakdownPanel />);
      act(() => showBreakdown('C2'));
      const limit = useEditor.getState().resultById.C2!.limit!;
      for (const s of segments(container)) {
        expect(s.text).toContain(`${s.z.toFixed(3)} Ω`);
        expect(s.text).toContain(`${((s.z / limit) * 100).toFixed(1)} % of limit`);
      }
      expect(segments(container)[0]!.text).toContain('upstream');
      expect(segments(container)[2]!.text).not.toContain('upstream');
      expect(container.querySelector('.lwp-breakdown-verdict')!.textContent).toContain('FAIL');
    });
  });

  it('with the source unknown, compares own and upstream parts with their shares', () => {
    load(sampleJob('unknown'));
    const { container } = render(<BreakdownPanel />);
    act(() => showBreakdown('C1'));
    const segs = segments(container);
    expect(segs.map((s) => [s.id, s.upstream])).toEqual([['M1', true], ['C1', false]]);
    const r = useEditor.getState().resultById.C1!;
    const own = container.querySelector('[data-breakdown-part="own"]')!.textContent!;
    expect(own).toContain(`${r.own!.toFixed(3)} Ω against ${r.limit!.toFixed(3)} Ω`);
    // The upstream part may use the other 20 %: limit × 0.2 / 0.8.
    const up = container.querySelector('[data-breakdown-part="upstream"]')!.textContent!;
    expect(up).toContain(`${r.upstream!.toFixed(3)} Ω against ${((r.limit! * 0.2) / 0.8).toFixed(3)} Ω`);
  });

  it('closes, clearing the breakdown and the highlight', () => {
    load(sampleJob());
    const { container } = render(<BreakdownPanel />);
    act(() => showBreakdown('C3'));
    expect(useEditor.getState().highlightPath).toEqual(['S1', 'M1', 'MSB', 'C3', 'P3']);
    fireEvent.click(container.querySelector('[data-action="close-breakdown"]')!);
    expect(useEditor.getState().breakdownLink).toBeNull();
    expect(useEditor.getState().highlightPath).toBeNull();
    expect(container.innerHTML).toBe('');
  });
});

describe('the breakdown follows the selected circuit', () => {
  function Harness() {
    useBreakdownFollowsSelection();
    return <BreakdownPanel />;
  }
  const shown = (container: HTMLElement) => container.querySelector('[data-breakdown]')?.getAttribute('data-breakdown');

  beforeEach(() => {
    load(sampleJob());
    useBreakdownView.getState().set({ pinned: false, collapsed: false });
  });

  it('moves to the link selected next, with the highlighted path, and says so in its head', () => {
    const { container } = render(<Harness />);
    act(() => showBreakdown('C3'));
    expect(container.querySelector('[data-breakdown-mode]')!.getAttribute('data-breakdown-mode')).toBe('follows');
    act(() => useEditor.getState().select({ nodes: [], links: ['C1'] }));
    expect(useEditor.getState().breakdownLink).toBe('C1');
    expect(useEditor.getState().highlightPath).toEqual(['S1', 'M1', 'MSB', 'C1', 'P1']);
    expect(shown(container)).toBe('C1');
    expect(container.querySelector('h2')!.textContent).toContain('C1');
  });

  it('stays where it is when nodes, several links or nothing are selected', () => {
    const { container } = render(<Harness />);
    act(() => showBreakdown('C3'));
    act(() => useEditor.getState().select({ nodes: ['MSB'], links: [] }));
    act(() => useEditor.getState().select({ nodes: [], links: ['C1', 'C2'] }));
    act(() => useEditor.getState().select({ nodes: [], links: [] }));
    expect(useEditor.getState().breakdownLink).toBe('C3');
    expect(shown(container)).toBe('C3');
  });

  it('stays on its link while pinned, and follows again once unpinned', () => {
    const { container } = render(<Harness />);
    act(() => showBreakdown('C3'));
    fireEvent.click(container.querySelector('[data-action="pin-breakdown"]')!);
    expect(container.querySelector('[data-panel="breakdown"]')!.getAttribute('data-pinned')).toBe('true');
    expect(container.querySelector('[data-breakdown-mode]')!.textContent).toMatch(/Pinned to C3/);
    act(() => useEditor.getState().select({ nodes: [], links: ['C1'] }));
    expect(useEditor.getState().breakdownLink).toBe('C3');
    expect(useEditor.getState().highlightPath).toEqual(['S1', 'M1', 'MSB', 'C3', 'P3']);
    fireEvent.click(container.querySelector('[data-action="pin-breakdown"]')!);
    act(() => useEditor.getState().select({ nodes: [], links: ['C2'] }));
    expect(useEditor.getState().breakdownLink).toBe('C2');
  });

  it('does not open by itself: with the breakdown closed, a selection changes nothing', () => {
    const { container } = render(<Harness />);
    act(() => useEditor.getState().select({ nodes: [], links: ['C1'] }));
    expect(useEditor.getState().breakdownLink).toBeNull();
    expect(container.innerHTML).toBe('');
  });

  it('forgets the pin when closed, and folds to its head', () => {
    const { container } = render(<Harness />);
    act(() => showBreakdown('C3'));
    fireEvent.click(container.querySelector('[data-action="collapse-breakdown"]')!);
    expect(container.querySelector('[data-segment]')).toBeNull();
    expect(container.querySelector('h2')!.textContent).toContain('C3');
    fireEvent.click(container.querySelector('[data-action="collapse-breakdown"]')!);
    expect(container.querySelector('[data-segment]')).not.toBeNull();
    fireEvent.click(container.querySelector('[data-action="pin-breakdown"]')!);
    fireEvent.click(container.querySelector('[data-action="close-breakdown"]')!);
    expect(useBreakdownView.getState().pinned).toBe(false);
    act(() => showBreakdown('C3'));
    act(() => useEditor.getState().select({ nodes: [], links: ['C1'] }));
    expect(useEditor.getState().breakdownLink).toBe('C1');
  });
});
