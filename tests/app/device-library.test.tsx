// The device library: built-in entries carry their sources and are complete devices the engine
// accepts; gG curves are monotone; the designer's own devices are stored with the app, never
// lost, and copied whole into a job that uses them.
import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { serialiseJob, type CurveDevice } from '../../engine/index.js';
import { DetailsPanel } from '../../app/renderer/panels/index.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { BREAKER_RATINGS, GG_GATES, LIBRARY, ggCurve, libraryEntry } from '../../app/renderer/panels/devices/library.js';
import {
  STORAGE_KEY, deviceForJob, deviceProblems, readStored, reloadUserDevices, saveUserDevice, useUserDevices,
} from '../../app/renderer/panels/devices/userDevices.js';
import { useDrafts } from '../../app/renderer/panels/devices/drafts.js';
import { choose, field, typeAndEnter } from './panels/dom.js';
import { linkOf, load, sampleJob } from './panels/fixture.js';

describe('built-in library', () => {
  it('every entry names its source and is a complete device the engine accepts', () => {
    expect(LIBRARY.length).toBeGreaterThan(0);
    for (const e of LIBRARY) {
      expect(e.source.length, e.id).toBeGreaterThan(10);
      expect(e.source, e.id).toMatch(/IEC 60898-1|IEC 60269-1/);
      expect(deviceProblems(e.device), e.id).toEqual([]);
    }
    // The gG values are recalled, and say so.
    for (const e of LIBRARY.filter((x) => x.id.startsWith('gG-'))) expect(e.source).toMatch(/from memory/);
  });

  it('offers B, C and D breakers from 6 A to 125 A, Ia left to the basis multiple', () => {
    for (const curve of ['B', 'C', 'D']) {
      for (const rating of BREAKER_RATINGS) {
        expect(libraryEntry(`mcb-${curve}-${rating}`)?.device).toEqual({ type: 'mcb', curve, rating });
      }
    }
    expect(Math.min(...BREAKER_RATINGS)).toBe(6);
    expect(Math.max(...BREAKER_RATINGS)).toBe(125);
  });

  it('a gG curve rises in current and falls in time, through the gates', () => {
    for (const g of GG_GATES) {
      const pts = ggCurve(g);
      for (let i = 1; i < pts.length; i++) {
        expect(pts[i]![0], `gG ${g.rating} A point ${i}`).toBeGreaterThan(pts[i - 1]![0]);
        expect(pts[i]![1], `gG ${g.rating} A point ${i}`).toBeLessThan(pts[i - 1]![1]);
      }
      // The gates themselves are ordered: Imin(10 s) < Imax(5 s), Imin(0.1 s) < Imax(0.1 s).
      expect(g.min10).toBeLessThan(g.max5);
      expect(g.min01).toBeLessThan(g.max01);
    }
  });

  it('gG 32 A: If 1.6 In within 1 h, Imax 150 A at 5 s and 350 A at 0.1 s', () => {
    const g = GG_GATES.find((x) => x.rating === 32)!;
    // IEC 60269-1 Table 2, gG 16 A ≤ In ≤ 63 A: If = 1.6 In, conventional time 1 h (from memory).
    expect(g.fusing).toBeCloseTo(51.2, 9);
    expect(g.conventionalTime).toBe(3600);
    // IEC 60269-1 Table 3, gG 32 A: Imax(5 s) 150 A, Imax(0.1 s) 350 A (from memory).
    expect(ggCurve(g)).toEqual([[51.2, 3600], [150, 5], [350, 0.1]]);
  });
});

describe("the designer's own devices", () => {
  beforeEach(() => {
    localStorage.clear();
    reloadUserDevices();
    load(sampleJob());
    useDrafts.setState({ drafts: {} });
  });

  const curve: CurveDevice = { type: 'curve', rating: 40, points: [[70, 1000], [200, 5], [500, 0.1]], breaking: 50, letThrough: 9000 };

  it('are saved with the app and read back', () => {
    expect(saveUserDevice('Maker X 40 A', curve)).toEqual({ ok: true });
    const again = readStored();
    expect(again.devices).toEqual([{ name: 'Maker X 40 A', device: curve }]);
    expect(JSON.parse(localStorage.getItem(STORAGE_KEY)!).devices).toHaveLength(1);
  });

  it('refuse a device the job format would refuse, naming the field', () => {
    const bad = saveUserDevice('bad', { ...curve, points: [[70, 1], [50, 5]] });
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.reason).toMatch(/device\.points/);
    const lt = saveUserDevice('bad', { ...curve, letThrough: -1 });
    expect(!lt.ok && lt.reason).toMatch(/letThrough/);
    expect(localStorage.getItem(STORAGE_KEY)).toBeNull();
  });

  it('keep what they cannot read: an unreadable store is set aside, a bad entry is kept and reported', () => {
    localStorage.setItem(STORAGE_KEY, '{not json');
    const state = readStored();
    expect(state.devices).toEqual([]);
    expect(state.problems[0]).toMatch(/could not be read/);
    const aside = Object.keys(localStorage).find((k) => k.startsWith(`${STORAGE_KEY}.unreadable-`))!;
    expect(localStorage.getItem(aside)).toBe('{not json');

    localStorage.setItem(STORAGE_KEY, JSON.stringify({
      format: 'loopwright.my-devices', version: 1,
      devices: [{ name: 'odd', device: { type: 'fixed', rating: 10 } }, { name: 'good', device: { type: 'mcb', curve: 'B', rating: 16 } }],
    }));
    const mixed = readStored();
    expect(mixed.devices.map((d) => d.name)).toEqual(['good']);
    expect(mixed.problems[0]).toMatch(/saved device 1 \("odd"\).*tripCurrent/);
    // Saving another keeps the unreadable entry as it was.
    expect(saveUserDevice('new', curve).ok).toBe(true);
    const stored = JSON.parse(localStorage.getItem(STORAGE_KEY)!).devices as Array<{ name: string }>;
    expect(stored.map((d) => d.name)).toEqual(['odd', 'good', 'new']);
  });

  it('picking one copies every field into the link, with its name as the label, so the job is self-contained', () => {
    saveUserDevice('Maker X 40 A', curve);
    expect(useUserDevices.getState().devices).toHaveLength(1);
    expect(deviceForJob(useUserDevices.getState().devices[0]!)).toEqual({ ...curve, label: 'Maker X 40 A' });
    const { container } = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: [], links: ['C1'] }));
    choose(field<HTMLSelectElement>(container, 'device.library'), 'mine:0');
    expect(linkOf('C1').device).toEqual({ ...curve, label: 'Maker X 40 A' });
    // Removing it from the app later does not touch the job.
    localStorage.clear();
    reloadUserDevices();
    const saved = JSON.parse(serialiseJob(useEditor.getState().job)) as { links: Array<{ id: string; device?: unknown }> };
    expect(saved.links.find((l) => l.id === 'C1')!.device).toEqual({ ...curve, label: 'Maker X 40 A' });
  });

  it('names the source of a device while it is exactly a library entry, and stops once it is edited', () => {
    const { container } = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: [], links: ['C2'] }));
    // C2 is a C20 breaker: exactly the library's entry.
    expect(container.querySelector('[data-device-source]')!.textContent).toMatch(/^C20 breaker: IEC 60898-1 curve C/);
    choose(field<HTMLSelectElement>(container, 'device.library'), 'lib:gG-25');
    expect(container.querySelector('[data-device-source]')!.textContent).toMatch(/^25 A gG fuse: IEC 60269-1/);
    typeAndEnter(field(container, 'device.rating'), '24');
    expect(container.querySelector('[data-device-source]')).toBeNull();
  });

  it('the device editor saves the link’s device under a name', () => {
    const { container } = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: [], links: ['C2'] }));
    const name = field(container, 'my-device.name');
    fireEvent.change(name, { target: { value: 'Shed breaker' } });
    fireEvent.click(container.querySelector('[data-action="save-my-device"]')!);
    expect(readStored().devices).toEqual([{ name: 'Shed breaker', device: { type: 'mcb', curve: 'C', rating: 20 } }]);
  });
});
