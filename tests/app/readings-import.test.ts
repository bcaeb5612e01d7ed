// Importing readings from a CSV file into the open job: a good file is one undoable edit and
// the user is told how many readings came in; a bad one changes nothing and lists its problems.
// Readings are invented test data.
import { beforeEach, describe, expect, it } from 'vitest';
import { parseJob, serialiseJob } from '../../engine/index.js';
import { importReadingsFromInput, importReadingsText } from '../../app/renderer/io/readings-import.js';
import { useUi } from '../../app/renderer/app/ui.js';
import { getCommand } from '../../app/renderer/commands/registry.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { linkOf, load, sampleJob } from './panels/fixture.js';

describe('importing readings', () => {
  beforeEach(() => {
    load(sampleJob());
    useUi.getState().set({ problems: null });
  });

  it('records every reading as one edit, says how many, and one undo takes them all back', () => {
    const before = useEditor.getState().job;
    const n = importReadingsText('Link,Zs,Temperature,Date,Instrument\nC1,0.55,16,2026-12-02,Meter A\nC2,1.9,16,2026-12-02,Meter A\n', 'site.csv');
    expect(n).toBe(2);
    expect(linkOf('C1').measured).toEqual({ zs: 0.55, temperature: 16, date: '2026-12-02', instrument: 'Meter A' });
    expect(linkOf('C2').measured).toEqual({ zs: 1.9, temperature: 16, date: '2026-12-02', instrument: 'Meter A' });
    expect(useEditor.getState().message).toEqual({
      kind: 'info',
      text: 'Imported 2 readings from site.csv (one step: Undo takes them all back)',
    });
    expect(useEditor.getState().dirty).toBe(true);
    expect(useEditor.getState().undoLabel).toBe('import 2 readings');
    // The engine judges them: every imported reading has a measured result.
    expect(useEditor.getState().resultById.C1!.measured?.zs).toBe(0.55);
    // Saved and opened again, the readings are the same.
    const reopened = parseJob(serialiseJob(useEditor.getState().job));
    if (!reopened.ok) throw new Error('the saved job does not open');
    expect(reopened.job.links.map((l) => l.measured)).toEqual(useEditor.getState().job.links.map((l) => l.measured));
    useEditor.getState().undo();
    expect(useEditor.getState().job).toBe(before);
    expect(linkOf('C1').measured).toBeUndefined();
    expect(linkOf('C2').measured).toBeUndefined();
    expect(useEditor.getState().canUndo).toBe(false);
  });

  it('refuses a file with a bad value: nothing is half-applied, and every problem is listed with its line and column', () => {
    const before = useEditor.getState().job;
    const n = importReadingsText('link,zs,temperature\nC1,0.55,16\nC2,-1,16\nC3,0.9,75\n', 'bad.csv');
    expect(n).toBe(0);
    expect(useEditor.getState().job).toBe(before);
    expect(linkOf('C1').measured).toBeUndefined();
    expect(useEditor.getState().canUndo).toBe(false);
    expect(useUi.getState().problems).toEqual({
      title: 'bad.csv: no readings imported (nothing was changed)',
      lines: [
        'line 3, column 2 (Zs): Zs must be a number greater than 0 (Ω), got "-1"',
        'line 4, column 3 (temperature): the temperature must be from -30 to 60 °C, got "75"',
      ],
    });
    expect(useEditor.getState().message).toEqual({ kind: 'error', text: 'bad.csv was not imported: 2 problems; nothing was changed' });
  });

  it('reads the file chosen in the file input (browser and desktop alike), then clears the input', async () => {
    const input = document.createElement('input');
    input.type = 'file';
    const file = new File(['link,zs\nC3,0.8\n'], 'garage.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { configurable: true, value: [file] });
    await importReadingsFromInput(input);
    expect(linkOf('C3').measured).toEqual({ zs: 0.8 });
    expect(useEditor.getState().message?.text).toBe('Imported 1 reading from garage.csv (one step: Undo takes them all back)');
  });

  it('is a command on the File menu and the toolbar that opens a file chooser for CSV files', () => {
    const command = getCommand('readings.import');
    expect(command).toMatchObject({ group: 'file', toolbar: 'Import readings' });
    let clicked: HTMLInputElement | null = null;
    const spy = (e: Event) => {
      clicked = e.target as HTMLInputElement;
      e.preventDefault();
    };
    document.addEventListener('click', spy, true);
    try {
      void command!.run({} as never);
    } finally {
      document.removeEventListener('click', spy, true);
    }
    expect(clicked).not.toBeNull();
    expect(clicked!.type).toBe('file');
    expect(clicked!.accept).toContain('.csv');
    expect(clicked!.hasAttribute('data-import-readings')).toBe(true);
  });
});

describe('importing readings without a click', () => {
  it('says where to click when the file chooser cannot open (a command with no user activation, as from a native menu)', () => {
    const nav = navigator as Navigator & { userActivation?: { isActive: boolean } };
    Object.defineProperty(nav, 'userActivation', { configurable: true, value: { isActive: false } });
    let clicked = false;
    const spy = (e: Event) => {
      clicked = true;
      e.preventDefault();
    };
    document.addEventListener('click', spy, true);
    try {
      void getCommand('readings.import')!.run({} as never);
    } finally {
      document.removeEventListener('click', spy, true);
      delete (nav as { userActivation?: unknown }).userActivation;
    }
    expect(clicked).toBe(false);
    expect(useEditor.getState().message?.text).toMatch(/^To choose a readings file, click Import readings/);
  });
});
