// Hostile text in outputs. Names, notes and ids come from job files that arrive from other
// people, so every output that shows them passes them through one of these first:
// - plainText: one line for a drawing or a PDF. Tabs, line breaks and other line separators
//   become spaces; every other control character (C0, DEL, C1), the bidirectional embedding,
//   override and isolate controls (which can make text read in a different order than it is
//   stored), unpaired surrogates and the non-characters U+FFFE and U+FFFF are dropped.
// - terminalText: the same, keeping line breaks, for what the command line prints. No escape
//   sequence (ESC, CSI) can reach the terminal.
// - xmlText: plainText escaped for XML text and attribute values; what is left is always
//   allowed by XML 1.0 (which forbids most C0 controls, unpaired surrogates, U+FFFE and U+FFFF).
// - csvCell: one CSV cell. Control characters go as above (tabs and line breaks stay, quoted);
//   then a cell a spreadsheet would run as a formula (first character `=`, `+`, `@`, tab or
//   carriage return, or `-` when the cell is not a number) gets a single quote in front and is
//   quoted, as the OWASP guidance on CSV injection recommends, so it shows as the text it is;
//   then RFC 4180 quoting (a field with a comma, a quote or a line break is quoted, inner
//   quotes doubled).

/** Unpaired surrogates (half a character, which no encoder can write). */
const LONE = '[\\ud800-\\udbff](?![\\udc00-\\udfff])|(?<![\\ud800-\\udbff])[\\udc00-\\udfff]';
const BIDI = '\\u202a-\\u202e\\u2066-\\u2069';
/** Line breaks and tabs: a space in one-line output. */
const SPACES = /[\t\n\v\f\r\u0085\u2028\u2029]/g;
const DROP_PLAIN = new RegExp(`[\\u0000-\\u0008\\u000e-\\u001f\\u007f-\\u0084\\u0086-\\u009f${BIDI}\\ufffe\\uffff]|${LONE}`, 'g');
const DROP_TERMINAL = new RegExp(`[\\u0000-\\u0009\\u000b-\\u001f\\u007f-\\u009f${BIDI}\\ufffe\\uffff\\u2028\\u2029]|${LONE}`, 'g');
const DROP_CSV = new RegExp(`[\\u0000-\\u0008\\u000b\\u000c\\u000e-\\u001f\\u007f-\\u009f${BIDI}\\ufffe\\uffff]|${LONE}`, 'g');

/** One line of text safe to draw: see the head of this file. */
export function plainText(text: string): string {
  return text.replace(SPACES, ' ').replace(DROP_PLAIN, '');
}

/** Text safe to print to a terminal: line breaks kept, tabs as spaces, every other control gone. */
export function terminalText(text: string): string {
  return text.replace(/\t/g, ' ').replace(DROP_TERMINAL, '');
}

/** Text for XML content or a double-quoted attribute value, always well-formed XML 1.0. */
export function xmlText(text: string): string {
  return plainText(text).replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
}

const NUMBER = /^-(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** True when a spreadsheet opening the CSV would take the cell for a formula. */
export function looksLikeFormula(cell: string): boolean {
  const first = cell.charAt(0);
  if (first === '=' || first === '+' || first === '@' || first === '\t' || first === '\r') return true;
  return first === '-' && !NUMBER.test(cell);
}

/** One CSV cell: controls dropped, a formula defused with a leading quote, RFC 4180 quoting. */
export function csvCell(value: string): string {
  const clean = value.replace(DROP_CSV, '');
  if (looksLikeFormula(clean)) return `"'${clean.replace(/"/g, '""')}"`;
  return /[",\r\n]/.test(clean) ? `"${clean.replace(/"/g, '""')}"` : clean;
}
