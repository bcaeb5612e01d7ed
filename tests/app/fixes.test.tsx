// One-click fixes (app/renderer/panels/fixes): each kind the engine offers for a failing circuit,
// applied from the details panel or the schedule's menu as one undoable edit, changes the
// circuit's status at once. Jobs are invented test data (tests/app/panels/fixture.ts).
import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import type { CircuitResult, Fix } from '../../engine/index.js';
import { DetailsPanel, SchedulePanel } from '../../app/renderer/panels/index.js';
import { fixMessage, planFix, roundDownTenth } from '../../app/renderer/panels/fixes/apply.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { linkOf, load, sampleJob } from './panels/fixture.js';

function result(id: string): CircuitResult {
  const r = useEditor.getState().resultById[id];
  if (!r) throw new Error(`no result for ${id}`);
  return r;
}

function fixOf(id: string, kind: Fix['kind']): Fix {
  const fix = result(id).fixes.find((f) => f.kind === kind);
  if (!fix) throw new Error(`the engine offers no ${kind} fix for ${id}: ${JSON.stringify(result(id).fixes)}`);
  return fix;
}

function badge(container: HTMLElement, id: string): string | null {
  return container.querySelector(`[data-results="${id}"] [data-status-badge]`)?.getAttribute('data-status-badge') ?? null;
}

function showDetails(id: string) {
  const view = render(<DetailsPanel />);
  act(() => useEditor.getState().select({ nodes: [], links: [id] }));
  return view;
}

function clickFix(container: ParentNode, kind: Fix['kind'], link: string) {
  const button = container.querySelector<HTMLButtonElement>(`[data-fix="${kind}"][data-fix-link="${link}"]`);
  if (!button) throw new Error(`no ${kind} fix button for ${link}`);
  act(() => fireEvent.click(button));
}

describe('fixes in the details panel', () => {
  beforeEach(() => load(sampleJob()));

  it('lists the engine’s fixes for a failing circuit, in its order, and none for a passing one', () => {
    // C2 (120 m of 2.5 mm² on a C20, source unknown) fails its loop check.
    expect(result('C2').status).toBe('fail');
    expect(result('C2').fixes.map((f) => f.kind)).toEqual(['length', 'size', 'device', 'rcd']);
    const { container } = showDetails('C2');
    const buttons = [...container.querySelectorAll('[data-fixes="C2"] [data-fix]')].map((b) => b.getAttribute('data-fix'));
    expect(buttons).toEqual(['length', 'size', 'device', 'rcd']);
    act(() => useEditor.getState().select({ nodes: [], links: ['C1'] }));
    expect(result('C1').status).toBe('pass');
    expect(container.querySelector('[data-fixes]')).toBeNull();
  });

  it('length: sets the length to the maximum rounded down to 0.1 m, the circuit passes, and one undo puts it back', () => {
    const fix = fixOf('C2', 'length') as Extract<Fix, { kind: 'length' }>;
    const { container } = showDetails('C2');
    expect(badge(container, 'C2')).toBe('fail');
    clickFix(container, 'length', 'C2');
    const length = linkOf('C2').cable.length;
    expect(length).toBe(Math.floor(fix.maxLength * 10) / 10);
    expect(length).toBeLessThanOrEqual(fix.maxLength);
    expect(badge(container, 'C2')).toBe('pass');
    const message = useEditor.getState().message!.text;
    expect(message).toContain(`${length.toFixed(1)} m`);
    expect(message).toContain('rounded down to 0.1 m, so it still passes');
    expect(message).toMatch(/C2 is now ✓ pass/);
    act(() => useEditor.getState().undo());
    expect(linkOf('C2').cable.length).toBe(120);
    expect(badge(container, 'C2')).toBe('fail');
  });

  it('size: sets the active and earth sizes and the circuit passes', () => {
    const fix = fixOf('C2', 'size') as Extract<Fix, { kind: 'size' }>;
    const { container } = showDetails('C2');
    clickFix(container, 'size', 'C2');
    expect(linkOf('C2').cable).toMatchObject({ active: fix.active, earth: fix.earth, length: 120, material: 'Cu' });
    expect(badge(container, 'C2')).toBe('pass');
    act(() => useEditor.getState().undo());
    expect(linkOf('C2').cable).toMatchObject({ active: 2.5, earth: 2.5 });
  });

  it('device: sets the protecting breaker’s curve and rating and the circuit passes', () => {
    const fix = fixOf('C2', 'device') as Extract<Fix, { kind: 'device' }>;
    const { container } = showDetails('C2');
    clickFix(container, 'device', 'C2');
    expect(linkOf('C2').device).toEqual({ type: 'mcb', curve: fix.curve, rating: fix.rating });
    expect(badge(container, 'C2')).toBe('pass');
    act(() => useEditor.getState().undo());
    expect(linkOf('C2').device).toEqual({ type: 'mcb', curve: 'C', rating: 20 });
  });

  it('rcd: adds a 30 mA RCD; the circuit then relies on it, which is said plainly and is not a pass', () => {
    const { container } = showDetails('C2');
    const button = container.querySelector('[data-fix="rcd"]')!;
    expect(button.textContent).toContain('not a pass');
    clickFix(container, 'rcd', 'C2');
    expect(linkOf('C2').rcd).toEqual({ sensitivity: 0.03 });
    expect(badge(container, 'C2')).toBe('rcd');
    expect(result('C2').status).toBe('rcd');
    expect(useEditor.getState().message!.text).toMatch(/C2 now relies on the RCD .*: it is not a pass/);
    act(() => useEditor.getState().undo());
    expect(linkOf('C2').rcd).toBeUndefined();
    expect(badge(container, 'C2')).toBe('fail');
  });

  it('is offered for a circuit that relies on its RCD too (C3), and a fix there makes it pass', () => {
    expect(result('C3').status).toBe('rcd');
    const { container } = showDetails('C3');
    expect(container.querySelector('[data-fix="rcd"]')).toBeNull(); // it has an RCD already
    clickFix(container, 'size', 'C3');
    expect(badge(container, 'C3')).toBe('pass');
  });
});

describe('a failing check with no one-click fix', () => {
  it('is said plainly in the details panel, with what to change by hand', () => {
    // C1 passes its loop check; with Ib 10 A, a stated Iz of 16 A below its 20 A breaker fails Ib ≤ In ≤ Iz.
    const job = sampleJob();
    load({ ...job, links: job.links.map((l) => (l.id === 'C1' ? { ...l, designCurrent: 10, cable: { ...l.cable, capacity: 16 } } : l)) });
    expect(result('C1').status).toBe('pass');
    expect(result('C1').capacityStatus).toBe('fail');
    expect(result('C1').fixes).toEqual([]);
    const { container } = showDetails('C1');
    const manual = container.querySelector('[data-fixes-manual="C1"]')!;
    expect(manual.textContent).toContain('✗ FAIL: no one-click fix');
    expect(manual.querySelector('[data-manual-check]')!.textContent).toBe('cable capacity (Ib ≤ In ≤ Iz): a larger cable, or a device rating between Ib and Iz.');
    expect(container.querySelector('[data-fix]')).toBeNull();
  });
});

describe('fixes in the schedule', () => {
  beforeEach(() => load(sampleJob()));

  it('a row’s Fix menu lists the fixes and one click applies one; the row’s status changes at once', () => {
    const { container } = render(<SchedulePanel />);
    const row = () => container.querySelector<HTMLElement>('[data-schedule-row="C2"]')!;
    const status = () => row().querySelector('.lwp-sticky-status [data-status-badge]')!.getAttribute('data-status-badge');
    expect(status()).toBe('fail');
    // A passing row has no menu.
    expect(container.querySelector('[data-fix-menu="C1"]')).toBeNull();
    act(() => fireEvent.click(row().querySelector('[data-fix-menu="C2"]')!));
    // The menu is on the page's body, outside the contained schedule body (which would clip it).
    const menu = document.querySelector('[data-fix-menu-list="C2"]')!;
    expect(container.contains(menu)).toBe(false);
    expect([...menu.querySelectorAll('[data-fix]')].map((b) => b.getAttribute('data-fix'))).toEqual(['length', 'size', 'device', 'rcd']);
    clickFix(menu, 'device', 'C2');
    expect(status()).toBe('pass');
    expect(document.querySelector('[data-fix-menu-list]')).toBeNull(); // the menu closes
    expect(useEditor.getState().undoLabel).toMatch(/^fix C2: device/);
  });
});

describe('the Fix menu by keyboard', () => {
  beforeEach(() => load(sampleJob()));

  it('opens with the focus on its first fix, and Escape closes it with the focus back on its button', () => {
    const { container } = render(<SchedulePanel />);
    const button = container.querySelector<HTMLButtonElement>('[data-fix-menu="C2"]')!;
    expect(button.getAttribute('aria-expanded')).toBe('false');
    act(() => fireEvent.click(button));
    expect(button.getAttribute('aria-expanded')).toBe('true');
    const first = document.querySelector('[data-fix-menu-list="C2"] [data-fix]');
    expect(document.activeElement).toBe(first);
    act(() => void fireEvent.keyDown(first!, { key: 'Escape' }));
    expect(document.querySelector('[data-fix-menu-list]')).toBeNull();
    expect(document.activeElement).toBe(button);
    expect(linkOf('C2').cable.length).toBe(120); // nothing applied
  });

  it('closes when the focus tabs out of it', () => {
    const { container } = render(<><SchedulePanel /><button type="button" data-elsewhere>elsewhere</button></>);
    const button = container.querySelector<HTMLButtonElement>('[data-fix-menu="C2"]')!;
    act(() => fireEvent.click(button));
    const first = document.querySelector('[data-fix-menu-list="C2"] [data-fix]')!;
    const next = document.querySelectorAll('[data-fix-menu-list="C2"] [data-fix]')[1]!;
    act(() => void fireEvent.blur(first, { relatedTarget: next })); // within the menu: stays open
    expect(document.querySelector('[data-fix-menu-list]')).not.toBeNull();
    act(() => void fireEvent.blur(next, { relatedTarget: container.querySelector('[data-elsewhere]') }));
    expect(document.querySelector('[data-fix-menu-list]')).toBeNull();
  });
});

describe('planning a fix', () => {
  it('rounds a length down to 0.1 m, never up', () => {
    expect(roundDownTenth(68.1454560351603)).toBe(68.1);
    expect(roundDownTenth(54.09999)).toBe(54);
    expect(roundDownTenth(42.3)).toBe(42.3);
    expect(roundDownTenth(0.05)).toBe(0);
    for (const x of [0.1, 0.3, 1.7, 12.9, 99.99, 123.45]) expect(roundDownTenth(x)).toBeLessThanOrEqual(x);
  });

  it('changes the protecting link for a device or RCD fix when another link’s device protects the circuit', () => {
    const job = sampleJob();
    const links = [
      ...job.links.map((l) =>
        l.id === 'C2' ? { ...l, device: { type: 'mcb' as const, curve: 'C' as const, rating: 20, label: 'Old C20', letThrough: 20000, breaking: 6 } } : l,
      ),
      { id: 'C2b', from: 'P2', to: 'P5', cable: { length: 30, material: 'Cu' as const, active: 2.5, earth: 2.5 } },
    ];
    const far = { link: 'C2b', protectedBy: 'C2' } as CircuitResult;
    const device = planFix({ links }, far, { kind: 'device', curve: 'B', rating: 16 });
    if ('error' in device) throw new Error(device.error);
    expect(device.target).toBe('C2');
    // The label and let-through energy described the old device; the breaking capacity stays.
    expect(device.edit).toEqual({ op: 'update-link', id: 'C2', patch: { device: { type: 'mcb', curve: 'B', rating: 16, breaking: 6 } } });
    expect(device.description).toBe('set the device on C2 (which protects C2b) to a curve B breaker of 16 A (its label and its let-through energy cleared: they described the old device)');
    const rcd = planFix({ links }, far, { kind: 'rcd', sensitivity: 0.03 });
    if ('error' in rcd) throw new Error(rcd.error);
    expect(rcd.edit).toEqual({ op: 'update-link', id: 'C2', patch: { rcd: { sensitivity: 0.03 } } });
    expect(fixMessage('C2b', { kind: 'rcd', sensitivity: 0.03 }, rcd, { ...far, status: 'rcd' } as CircuitResult))
      .toBe('Applied a fix to C2b: add a 30 mA RCD on C2 (which protects C2b). C2b now relies on the RCD to disconnect an earth fault (⚠ RCD-reliant): it is not a pass.');
    // A fix that clears the loop while another check still fails says which.
    const length = planFix({ links }, { link: 'C2', protectedBy: 'C2' } as CircuitResult, { kind: 'length', maxLength: 50.06 });
    if ('error' in length) throw new Error(length.error);
    const still = { link: 'C2', status: 'pass', verdict: 'fail', voltageStatus: 'fail', capacityStatus: 'pass', breakingStatus: 'unchecked', withstandStatus: 'unchecked', measured: null } as unknown as CircuitResult;
    expect(fixMessage('C2', { kind: 'length', maxLength: 50.06 }, length, still))
      .toBe('Applied a fix to C2: set the length of C2 to 50.0 m (its maximum 50.06 m rounded down to 0.1 m, so it still passes). C2: loop impedance now ✓ pass; still ✗ FAIL on voltage drop.');
    // An unprotected circuit has no device to change.
    expect(planFix({ links }, { link: 'C2b', protectedBy: null } as CircuitResult, { kind: 'device', curve: 'B', rating: 16 }))
      .toEqual({ error: 'C2b has no protecting device to change' });
  });
});
