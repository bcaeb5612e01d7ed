// Hostile text in every output (engine/report/sanitise.ts): a job whose names and ids carry
// spreadsheet formulas, terminal escapes, markup and control characters goes through `check`,
// `check --csv` and `report --svg` as a user would run them; formulas come out defused, no
// control character reaches the terminal, and every SVG sheet is well-formed XML. Also: the
// command line reads at most the size limit from a device or a pipe.

import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { analyse, CAUTION, csvCell, loadJob, plainText, scheduleCsv, sheetToSvg, terminalText, xmlText, type Job } from '../../engine/index.js';
import { layoutReport } from '../../engine/report/index.js';
import { readTextFile } from '../../app/cli/io.js';
import { runCli } from '../../app/cli/run.js';
import { renderCheck } from '../../app/cli/table.js';
import { board, cable, jobFile, link, mcb, point, unknownSupply } from '../engine/helpers.js';
import { cli, looksLikeStackTrace } from './run.js';

const scratch = mkdtempSync(join(tmpdir(), 'loopwright-hostile-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** C0 (but line feed), DEL and C1 controls: what must never reach a terminal. */
const CONTROL = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f]/;
const ESC = '\u001b';

const NAMES = ['=SUM(A1)', '+1+1', '@cmd', '-2+3', '\tTab first', '\rCR first', `${ESC}[31mred${ESC}[0m`, '<script>alert(1)</script>', 'nul\u0000here', 'Feed one=main', 'bidi \u202eevil', 'csi \u009b2J'];

function hostileFile(): Record<string, unknown> {
  const points = NAMES.map((name, i) => point(`P${i + 1}`, 'socket-outlets', { name }));
  const links = NAMES.map((name, i) => link(i === 0 ? `C1${ESC}[2J` : `C${i + 1}`, 'DB', `P${i + 1}`, cable(20, 2.5, 2.5), { name, device: mcb('C', 20) }));
  const file = jobFile({
    nodes: [unknownSupply('S1'), board('DB', { name: '=HYPERLINK("http://example.invalid")' }), ...points],
    links: [link('M1', 'S1', 'DB', cable(10, 16, 6), { name: 'Feed one=main' }), ...links],
  });
  (file.job as Record<string, unknown>).title = `Title ${ESC}]0;owned\u0007 <b>&</b>`;
  return file;
}

function hostileJob(): Job {
  const loaded = loadJob(hostileFile());
  if (!loaded.ok) throw new Error(loaded.problems.map((p) => p.message).join('\n'));
  return loaded.job;
}

const job = hostileJob();
const file = join(scratch, 'hostile.lwj');
writeFileSync(file, JSON.stringify(hostileFile(), null, 2));

/** The cells of one CSV line (RFC 4180, no line breaks inside the cells here). */
function cells(line: string): string[] {
  const out: string[] = [];
  const re = /("(?:[^"]|"")*"|[^,]*)(,|$)/g;
  for (const m of line.matchAll(re)) {
    out.push(m[1] ?? '');
    if (m[2] === '') break;
  }
  return out;
}

// jsdom's XML parser (jsdom ships no types; only DOMParser is used).
const jsdomName = 'jsdom';
const { JSDOM } = (await import(jsdomName)) as { JSDOM: new (html: string) => { window: { DOMParser: typeof DOMParser } } };
const parser = new new JSDOM('').window.DOMParser();

function wellFormed(svg: string): string | null {
  const doc = parser.parseFromString(svg, 'image/svg+xml');
  const error = doc.getElementsByTagName('parsererror')[0];
  return error === undefined ? null : (error.textContent ?? 'parse error');
}

describe('sanitising, one piece at a time', () => {
  it('defuses cells a spreadsheet would run as a formula, and leaves numbers and plain text alone', () => {
    // OWASP, "CSV Injection": cells starting =, +, -, @, tab or carriage return get a leading
    // single quote and are quoted.
    expect(csvCell('=SUM(A1)')).toBe(`"'=SUM(A1)"`);
    expect(csvCell('+1+1')).toBe(`"'+1+1"`);
    expect(csvCell('@cmd')).toBe(`"'@cmd"`);
    expect(csvCell('-2+3')).toBe(`"'-2+3"`);
    expect(csvCell('\tx')).toBe(`"'\tx"`);
    expect(csvCell('\rx')).toBe(`"'\rx"`);
    expect(csvCell('=HYPERLINK("a")')).toBe(`"'=HYPERLINK(""a"")"`);
    expect(csvCell('-5')).toBe('-5');
    expect(csvCell('-0.25')).toBe('-0.25');
    expect(csvCell('-1.5e-3')).toBe('-1.5e-3');
    expect(csvCell('a=b')).toBe('a=b');
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a, b')).toBe('"a, b"');
    // A control character in front cannot hide a formula: it goes first, then the check.
    expect(csvCell('\u0000=1+1')).toBe(`"'=1+1"`);
    expect(csvCell(`${ESC}[31mx`)).toBe('[31mx');
  });

  it('drops control characters from drawn and printed text, keeping line breaks only for the terminal', () => {
    expect(plainText(`a${ESC}[31mb\u0000c\u009bd\u202ee`)).toBe('a[31mbcde');
    expect(plainText('two\nlines\tand\rmore')).toBe('two lines and more');
    expect(terminalText('line\none\ttab\r')).toBe('line\none tab');
    expect(plainText('\ud800lone \udc00halves 😀')).toBe('lone halves 😀');
    expect(xmlText('<a href="x">&\'</a>\u0001\uffff')).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&apos;&lt;/a&gt;');
  });

  it('any text in a sheet gives well-formed XML', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 30 }), (name) => {
        const svg = `<svg xmlns="http://www.w3.org/2000/svg"><title>${xmlText(name)}</title><text x="1" y="1">${xmlText(name)}</text></svg>`;
        expect(wellFormed(svg)).toBeNull();
        expect(xmlText(name)).not.toMatch(CONTROL);
      }),
      { numRuns: 100 },
    );
  });
});

describe('a job with hostile names, in process', () => {
  const results = analyse(job);

  it('the CSV defuses every formula-like cell', () => {
    const lines = scheduleCsv(job, results).split('\r\n').filter((l) => l !== '');
    expect(lines).toHaveLength(job.links.length + 1);
    for (const line of lines) {
      for (const cell of cells(line)) {
        const value = cell.startsWith('"') ? cell.slice(1, -1).replace(/""/g, '"') : cell;
        expect(/^[=+@\t\r]/.test(value), `${line}: ${cell}`).toBe(false);
        if (value.startsWith('-')) expect(value, line).toMatch(/^-[\d.]+(e[+-]?\d+)?$/i);
        expect(value).not.toContain(ESC);
      }
    }
    expect(lines.join('\n')).toContain(`"'=SUM(A1)"`);
  });

  it('the terminal table holds no control character, and still shows the names', () => {
    const text = renderCheck(job, results);
    expect(text).not.toMatch(CONTROL);
    expect(text).toContain('[31mred[0m');
    expect(text).toContain('<script>alert(1)</script>');
    expect(text).toContain(CAUTION);
  });

  it('every SVG sheet is well-formed XML with no control character, and shows the names escaped', () => {
    const sheets = layoutReport(job, results);
    expect(sheets.length).toBeGreaterThan(0);
    for (const sheet of sheets) {
      const svg = sheetToSvg(sheet);
      expect(wellFormed(svg)).toBeNull();
      expect(svg).not.toMatch(CONTROL);
      expect(svg).not.toContain('<script');
    }
    const all = sheets.map(sheetToSvg).join('\n');
    expect(all).toContain('Feed one=main');
    expect(all).toContain('&lt;script&gt;');
  });
});

describe('check --json escapes what JSON.stringify leaves raw, in process', () => {
  // DEL, C1 controls (U+0085 next line, U+009B the one-byte CSI), the bidirectional embeddings and
  // overrides U+202A–U+202E and the isolates U+2066–U+2069 (Unicode UAX #9): each may only
  // appear as a \uXXXX escape in the output.
  const RAW = ['\u007f', '\u0080', '\u0085', '\u009b', '\u009f', '\u202a', '\u202b', '\u202c', '\u202d', '\u202e', '\u2066', '\u2067', '\u2068', '\u2069'];
  const RAW_RE = /[\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;
  const mixed = `a${RAW.join('b')}z`;
  const hostile = jobFile({
    nodes: [unknownSupply(`S\u202e1`), board(`DB\u007f`, { name: mixed, notes: mixed }), point(`P\u2066x\u2069`, 'socket-outlets', { name: mixed, notes: mixed })],
    links: [
      link(`M\u009b1`, `S\u202e1`, `DB\u007f`, cable(10, 16, 6), { name: mixed, notes: mixed, device: mcb('C', 63, { label: `lab\u202d${mixed}` }) }),
      link(`C\u00851`, `DB\u007f`, `P\u2066x\u2069`, cable(20, 2.5, 2.5), { name: mixed, device: mcb('C', 20) }),
    ],
  });
  (hostile.job as Record<string, unknown>).title = mixed;
  const path = join(scratch, 'raw-json.lwj');
  writeFileSync(path, JSON.stringify(hostile));

  async function checkJson(): Promise<{ status: number; out: string; err: string }> {
    let out = '';
    let err = '';
    const status = await runCli(['check', '--json', path], { out: (t) => (out += t), err: (t) => (err += t) });
    return { status, out, err };
  }

  it('writes every such character of names, ids and labels as \\uXXXX, and reads back the same document', async () => {
    const run = await checkJson();
    expect(run.status).not.toBe(2);
    expect(run.err).toBe('');
    expect(run.out).not.toMatch(RAW_RE);
    expect(run.out).not.toMatch(CONTROL);
    for (const c of RAW) expect(run.out).toContain(`\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
    // the escapes are JSON's own: parsing gives back the results with the texts unchanged
    const loaded = loadJob(hostile);
    if (!loaded.ok) throw new Error(loaded.problems.map((p) => p.message).join('\n'));
    const parsed = JSON.parse(run.out) as ReturnType<typeof analyse>;
    expect(parsed).toEqual(analyse(loaded.job));
    expect(parsed.circuits[0]!.name).toBe(mixed);
    expect(parsed.circuits[0]!.link).toBe('M\u009b1');
    expect(parsed.circuits[0]!.device).toBe(`lab\u202d${mixed}`);
    expect(parsed.circuits[1]!.to).toBe('P\u2066x\u2069');
    expect(parsed.supplies[0]!.node).toBe('S\u202e1');
  });

  it('changes nothing else: the hostile job of this file differs from JSON.stringify only in those escapes', async () => {
    // its names hold U+202E and U+009B (escaped here) and ESC, which JSON.stringify escapes itself
    const text = JSON.stringify(analyse(job), null, 2);
    expect(text).toContain('\u202e');
    expect(text).toContain('\u009b');
    let out = '';
    await runCli(['check', '--json', file], { out: (t) => (out += t), err: () => undefined });
    expect(out).toBe(`${text.replaceAll('\u202e', '\\u202e').replaceAll('\u009b', '\\u009b')}\n`);
    expect(out).toContain('\\u001b[31mred'); // ESC, as JSON.stringify writes it
  });

  it('keeps other characters as they are (accents, Ω, emoji, the no-break space)', async () => {
    const path2 = join(scratch, 'plain-json.lwj');
    const name = 'Küche é Ω 😀 a\u00a0b';
    writeFileSync(path2, JSON.stringify(jobFile({ nodes: [unknownSupply('S1'), point('P1', 'lighting')], links: [link('C1', 'S1', 'P1', cable(5, 1.5, 1.5), { name, device: mcb('B', 10) })] })));
    let out = '';
    await runCli(['check', '--json', path2], { out: (t) => (out += t), err: () => undefined });
    expect(out).toContain(`"name": "${name}"`);
  });
});

describe('the command line, run as a user would', () => {
  it('check prints no control character, even in the job title', () => {
    const run = cli('check', file);
    expect(run.status).not.toBe(2);
    expect(run.stdout).not.toMatch(CONTROL);
    expect(run.stderr).not.toMatch(CONTROL);
    expect(run.stdout).toContain('=SUM(A1)');
    expect(run.stdout).toContain(CAUTION);
  });

  it('check --csv gives defused cells and no terminal escape', () => {
    const run = cli('check', '--csv', file);
    expect(run.stdout).not.toContain(ESC);
    expect(run.stdout).not.toContain('\u009b');
    expect(run.stdout).toContain(`"'=SUM(A1)"`);
  });

  it('report --svg writes well-formed sheets and a PDF', () => {
    const dir = join(scratch, 'svg');
    const run = cli('report', file, '-o', join(scratch, 'hostile.pdf'), '--svg', dir);
    expect(run.stderr).not.toMatch(CONTROL);
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
    expect(run.status).not.toBe(2);
    const names = readdirSync(dir).filter((n) => n.endsWith('.svg'));
    expect(names.length).toBeGreaterThan(0);
    for (const name of names) expect(wellFormed(readFileSync(join(dir, name), 'utf8')), name).toBeNull();
    expect(readFileSync(join(scratch, 'hostile.pdf')).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it.skipIf(spawnSync('pdftotext', ['-v']).error !== undefined)('the PDF holds the names without their control characters', () => {
    const pdf = join(scratch, 'hostile-text.pdf');
    expect(cli('report', file, '-o', pdf).status).not.toBe(2);
    const text = spawnSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' }).stdout;
    expect(text).toContain('=SUM(A1)');
    expect(text).toContain('Feed one=main');
    // Line feeds and the form feed between pages are pdftotext's own.
    expect(text).not.toMatch(/[\u0000-\u0009\u000b\u000d-\u001f\u007f-\u009f]/);
  });

  it('a problem naming a hostile id reaches the terminal without its escape sequence', () => {
    const bad = hostileFile();
    ((bad.links as Record<string, unknown>[])[1]!.cable as Record<string, unknown>).length = -1;
    const path = join(scratch, 'bad.lwj');
    writeFileSync(path, JSON.stringify(bad));
    const run = cli('check', path);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/links\[1\] \(C1\[2J\): cable\.length/);
    expect(run.stderr).not.toMatch(CONTROL);
  });

  it('check /dev/zero stops at the size limit with a clear message', () => {
    const run = cli('check', '/dev/zero');
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/cannot read \/dev\/zero: it holds more than 50 MB, the limit for a job file/);
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
  });

  it('a job nested 6,000 deep is refused with its path', () => {
    const path = join(scratch, 'deep.lwj');
    writeFileSync(path, `{"format":"loopwright.job","version":2,"nodes":[],"links":[],"later":${'['.repeat(6000)}${']'.repeat(6000)}}`);
    const run = cli('check', path);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/more than 8 levels deep at later\[0\]\[0\]\[0\]\[0\]\[0\]\[0\]\[0\] \(line 1 column \d+\)/);
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
  });
});

describe('reading from a pipe', () => {
  it('reads at most the limit from a named pipe, and a small job through one', async () => {
    const fifo = join(scratch, 'pipe.lwj');
    await new Promise<void>((resolve, reject) => spawn('mkfifo', [fifo]).on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`mkfifo ${code}`)))));
    // A writer that would send 60 MB: the reader stops after the limit (the writer then gets a broken pipe).
    const writer = spawn('sh', ['-c', `head -c 60000000 /dev/zero > '${fifo}'`], { stdio: 'ignore' });
    const big = readTextFile(fifo);
    writer.kill();
    expect(big.ok).toBe(false);
    if (!big.ok) expect(big.message).toMatch(/holds more than 50 MB/);
    const small = spawn('sh', ['-c', `cat '${file}' > '${fifo}'`], { stdio: 'ignore' });
    const read = readTextFile(fifo);
    await new Promise((r) => small.on('exit', r));
    expect(read.ok).toBe(true);
    if (read.ok) expect(read.text).toBe(readFileSync(file, 'utf8'));
  });
});
