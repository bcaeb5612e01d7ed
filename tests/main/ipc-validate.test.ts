import { describe, expect, it } from 'vitest';
import {
  checkAccelerator,
  checkCloseReplyArgs,
  checkCommandId,
  checkDirtyArgs,
  checkJobPath,
  checkJobText,
  checkMenuArgs,
  checkNoArgs,
  checkPaper,
  checkPrintArgs,
  checkSaveArgs,
  checkSender,
  isOwnPageUrl,
  normaliseAccelerator,
  type OwnOrigins,
} from '../../app/main/ipc-validate.js';
import { FILE_COMMANDS } from '../../app/shared/commands-menu.js';
import { LIMITS } from '../../app/shared/ipc.js';

const own: OwnOrigins = { indexUrl: 'file:///opt/Loopwright/resources/app.asar/dist/renderer/index.html', devOrigin: null };
const dev: OwnOrigins = { ...own, devOrigin: 'http://127.0.0.1:5173' };
const JOB = '/home/ana/jobs/Warehouse.lwj';

function errorOf(r: { ok: boolean; error?: string }): string {
  expect(r.ok).toBe(false);
  return r.error ?? '';
}

describe('sender check', () => {
  it('accepts our index.html, with a query or hash', () => {
    expect(isOwnPageUrl(own.indexUrl, own)).toBe(true);
    expect(isOwnPageUrl(`${own.indexUrl}#/job`, own)).toBe(true);
    expect(isOwnPageUrl(`${own.indexUrl}?x=1`, own)).toBe(true);
  });

  it('refuses other file URLs, remote pages and junk', () => {
    expect(isOwnPageUrl('file:///etc/passwd', own)).toBe(false);
    expect(isOwnPageUrl('file:///opt/Loopwright/resources/app.asar/dist/renderer/other.html', own)).toBe(false);
    expect(isOwnPageUrl('https://example.com/index.html', own)).toBe(false);
    expect(isOwnPageUrl('http://127.0.0.1:5173/', own)).toBe(false); // no dev server outside development
    expect(isOwnPageUrl('data:text/html,<p>hi', own)).toBe(false);
    expect(isOwnPageUrl('about:blank', own)).toBe(false);
    expect(isOwnPageUrl('', own)).toBe(false);
    expect(isOwnPageUrl(42, own)).toBe(false);
    expect(isOwnPageUrl('not a url', own)).toBe(false);
  });

  it('accepts the dev server origin only in development, and only that origin', () => {
    expect(isOwnPageUrl('http://127.0.0.1:5173/', dev)).toBe(true);
    expect(isOwnPageUrl('http://127.0.0.1:5173/src/main.tsx', dev)).toBe(true);
    expect(isOwnPageUrl('http://127.0.0.1:5174/', dev)).toBe(false);
    expect(isOwnPageUrl('http://localhost:5173/', dev)).toBe(false);
    expect(isOwnPageUrl('https://evil.example/?http://127.0.0.1:5173', dev)).toBe(false);
  });

  it('refuses a foreign page, a sub-frame, a window that is not ours and a vanished frame', () => {
    expect(checkSender({ url: own.indexUrl, isTopLevel: true }, true, own)).toEqual({ ok: true, value: true });
    expect(errorOf(checkSender({ url: 'https://evil.example/', isTopLevel: true }, true, own))).toMatch(/not ours/);
    expect(errorOf(checkSender({ url: own.indexUrl, isTopLevel: false }, true, own))).toMatch(/sub-frame/);
    expect(errorOf(checkSender({ url: own.indexUrl, isTopLevel: true }, false, own))).toMatch(/not a Loopwright window/);
    expect(errorOf(checkSender(null, true, own))).toMatch(/gone/);
  });
});

describe('arguments', () => {
  it('job text: a string within the limit', () => {
    expect(checkJobText('{}')).toEqual({ ok: true, value: '{}' });
    expect(errorOf(checkJobText(42))).toMatch(/must be a string, got number/);
    expect(errorOf(checkJobText({ text: '{}' }))).toMatch(/got object/);
    expect(errorOf(checkJobText('x'.repeat(LIMITS.jobText + 1)))).toMatch(/the most accepted/);
  });

  it('paths: absolute .lwj, no NUL, no "..", not too long', () => {
    expect(checkJobPath(JOB).ok).toBe(true);
    expect(checkJobPath('C:\\Jobs\\Warehouse.LWJ').ok).toBe(true);
    expect(checkJobPath('\\\\server\\share\\a.lwj').ok).toBe(true);
    expect(errorOf(checkJobPath('jobs/a.lwj'))).toMatch(/absolute/);
    expect(errorOf(checkJobPath('/home/ana/.bashrc'))).toMatch(/\.lwj/);
    expect(errorOf(checkJobPath('/home/ana/../root/a.lwj'))).toMatch(/"\.\."/);
    expect(errorOf(checkJobPath('/home/a\0.lwj'))).toMatch(/NUL/);
    expect(errorOf(checkJobPath(`/${'a'.repeat(LIMITS.path)}.lwj`))).toMatch(/characters long/);
    expect(errorOf(checkJobPath(''))).toMatch(/characters long/);
    expect(errorOf(checkJobPath(['/a.lwj']))).toMatch(/must be a string/);
  });

  it('saveJob: only the window\'s own file may be named', () => {
    expect(checkSaveArgs(['{}', JOB, false], JOB)).toEqual({ ok: true, value: { text: '{}', path: JOB, saveAs: false } });
    expect(checkSaveArgs(['{}', null, true], null)).toEqual({ ok: true, value: { text: '{}', path: null, saveAs: true } });
    expect(errorOf(checkSaveArgs(['{}', '/home/ana/jobs/Other.lwj', false], JOB))).toMatch(/not the file this window has open/);
    expect(errorOf(checkSaveArgs(['{}', JOB, false], null))).toMatch(/not the file this window has open/);
    expect(errorOf(checkSaveArgs(['{}', JOB, 'yes'], JOB))).toMatch(/saveAs must be true or false/);
    expect(errorOf(checkSaveArgs(['{}', JOB], JOB))).toMatch(/expected 3 argument/);
    expect(errorOf(checkSaveArgs(['{}', JOB, false, 'extra'], JOB))).toMatch(/got 4/);
    expect(errorOf(checkSaveArgs([null, JOB, false], JOB))).toMatch(/job text must be a string/);
  });

  it('paper and print arguments', () => {
    expect(checkPaper(undefined)).toEqual({ ok: true, value: undefined });
    expect(checkPaper({ size: 'A4', orientation: 'portrait' })).toEqual({ ok: true, value: { size: 'A4', orientation: 'portrait' } });
    expect(errorOf(checkPaper({ size: 'A5', orientation: 'portrait' }))).toMatch(/paper.size/);
    expect(errorOf(checkPaper({ size: 'A4', orientation: 'sideways' }))).toMatch(/paper.orientation/);
    expect(errorOf(checkPaper({ size: 'A4', orientation: 'portrait', margin: 0 }))).toMatch(/unknown field.*margin/);
    expect(errorOf(checkPaper('A4'))).toMatch(/must be an object/);
    expect(checkPrintArgs(['{}'], 'print').ok).toBe(true);
    expect(errorOf(checkPrintArgs([], 'exportPdf'))).toMatch(/exportPdf: expected 1 to 2/);
    expect(errorOf(checkPrintArgs([1], 'exportPdf'))).toMatch(/exportPdf: job text/);
  });

  it('no-argument calls refuse arguments', () => {
    expect(checkNoArgs([], 'openJob').ok).toBe(true);
    expect(errorOf(checkNoArgs(['/etc/passwd'], 'openJob'))).toMatch(/openJob: expected 0/);
  });

  it('setDirty: a boolean and a plain title', () => {
    expect(checkDirtyArgs([true, 'Warehouse.lwj'])).toEqual({ ok: true, value: { dirty: true, title: 'Warehouse.lwj' } });
    expect(errorOf(checkDirtyArgs(['true', 'x']))).toMatch(/dirty must be true or false/);
    expect(errorOf(checkDirtyArgs([false, 'a\nb']))).toMatch(/control characters/);
    expect(errorOf(checkDirtyArgs([false, 'x'.repeat(LIMITS.title + 1)]))).toMatch(/the most is/);
    expect(errorOf(checkDirtyArgs([false]))).toMatch(/expected 2/);
  });

  it('close replies carry an issued-looking token and a well-formed reply', () => {
    expect(checkCloseReplyArgs(['3f1c-aa', { dirty: true, text: '{}' }]).ok).toBe(true);
    expect(checkCloseReplyArgs(['3f1c-aa', null])).toEqual({ ok: true, value: { token: '3f1c-aa', reply: null } });
    expect(errorOf(checkCloseReplyArgs(['../x', null]))).toMatch(/token/);
    expect(errorOf(checkCloseReplyArgs(['abc', { dirty: 1, text: '{}' }]))).toMatch(/dirty/);
    expect(errorOf(checkCloseReplyArgs(['abc', { dirty: true }]))).toMatch(/text must be a string/);
  });
});

describe('menu descriptors', () => {
  const good = { id: 'edit.undo', label: 'Undo', accelerator: 'CmdOrCtrl+Z', enabled: true, menu: 'edit' };

  it('accepts the fallback File commands as they are', () => {
    const r = checkMenuArgs([[...FILE_COMMANDS]]);
    expect(r).toEqual({ ok: true, value: FILE_COMMANDS });
  });

  it('command ids: group.name form, bounded', () => {
    expect(checkCommandId('view.zoom-to-fit').ok).toBe(true);
    expect(checkCommandId('sheet:arrange').ok).toBe(true);
    expect(errorOf(checkCommandId('Edit.Undo'))).toMatch(/not of the form/);
    expect(errorOf(checkCommandId('edit..undo'))).toMatch(/not of the form/);
    expect(errorOf(checkCommandId('edit.undo<script>'))).toMatch(/not of the form/);
    expect(errorOf(checkCommandId(`a${'b'.repeat(LIMITS.commandId)}`))).toMatch(/characters/);
  });

  it('accelerators: known modifiers and one key', () => {
    for (const a of ['CmdOrCtrl+Z', 'Shift+CmdOrCtrl+Z', 'Delete', 'F11', 'CmdOrCtrl+Plus', 'Alt+Shift+Up', 'CmdOrCtrl+0', 'CmdOrCtrl+/']) {
      expect(checkAccelerator(a).ok, a).toBe(true);
    }
    expect(checkAccelerator(null)).toEqual({ ok: true, value: null });
    expect(errorOf(checkAccelerator('Hyper+Z'))).toMatch(/unknown modifier/);
    expect(errorOf(checkAccelerator('Ctrl+Ctrl+Z'))).toMatch(/repeats/);
    expect(errorOf(checkAccelerator('Ctrl+Banana'))).toMatch(/does not end in a key/);
    expect(errorOf(checkAccelerator(''))).toMatch(/characters/);
    expect(normaliseAccelerator('Ctrl+Shift+Z')).toBe(normaliseAccelerator('shift+control+z'));
    expect(normaliseAccelerator('CmdOrCtrl+Z')).not.toBe(normaliseAccelerator('Ctrl+Z'));
  });

  it('refuses duplicates, two commands on one key, unknown fields and bad types', () => {
    expect(checkMenuArgs([[good]]).ok).toBe(true);
    expect(errorOf(checkMenuArgs([[good, { ...good }]]))).toMatch(/items\[1\]\.id: "edit.undo" appears twice/);
    expect(errorOf(checkMenuArgs([[good, { ...good, id: 'edit.back', accelerator: 'cmdorctrl+z' }]]))).toMatch(
      /already the shortcut of edit.undo/,
    );
    expect(errorOf(checkMenuArgs([[{ ...good, role: 'quit' }]]))).toMatch(/unknown field\(s\): role/);
    expect(errorOf(checkMenuArgs([[{ ...good, enabled: 'yes' }]]))).toMatch(/enabled must be true or false/);
    expect(errorOf(checkMenuArgs([[{ ...good, menu: 'window' }]]))).toMatch(/menu must be one of/);
    expect(errorOf(checkMenuArgs([[{ ...good, label: '   ' }]]))).toMatch(/label must not be empty/);
    expect(errorOf(checkMenuArgs([[{ ...good, label: 'x'.repeat(LIMITS.label + 1) }]]))).toMatch(/the most is/);
    expect(errorOf(checkMenuArgs([[{ ...good, separatorBefore: 'yes' }]]))).toMatch(/separatorBefore/);
    expect(errorOf(checkMenuArgs([[null]]))).toMatch(/items\[0\] must be an object/);
    expect(errorOf(checkMenuArgs([{ 0: good }]))).toMatch(/must be a list/);
    expect(errorOf(checkMenuArgs([[], []]))).toMatch(/expected 1/);
    const many = Array.from({ length: LIMITS.menuItems + 1 }, (_, i) => ({ ...good, id: `c.n${i}`, accelerator: null }));
    expect(errorOf(checkMenuArgs([many]))).toMatch(/at most/);
  });

  it('refuses objects with a doctored prototype', () => {
    const sneaky = Object.create({ inherited: true }) as Record<string, unknown>;
    Object.assign(sneaky, good);
    expect(errorOf(checkMenuArgs([[sneaky]]))).toMatch(/must be an object/);
  });
});
