// A small command-line option parser: each command declares its options, and anything
// else that starts with `-` is refused by name. Usage errors are values, never exceptions.

export interface OptionSpec {
  /** Long name without dashes: `json` for `--json`. */
  name: string;
  /** Optional one-letter alias without the dash: `o` for `-o`. */
  short?: string;
  /** Placeholder for the option's value (`FILE`); absent for a plain flag. */
  value?: string;
  /** Allowed values, when the option takes one of a fixed set. */
  choices?: readonly string[];
  /** One line for `--help`. */
  summary: string;
}

export interface ParsedArgs {
  positionals: string[];
  /** Flags are `true`; options with a value hold the string. Absent when not given. */
  options: Record<string, string | true>;
  help: boolean;
}

export type ParseOutcome = { ok: true; args: ParsedArgs } | { ok: false; message: string };

const HELP: OptionSpec = { name: 'help', short: 'h', summary: 'describe this command and its options' };

/** Parse `argv` (the words after the command name) against the command's options. */
export function parseArgs(argv: readonly string[], specs: readonly OptionSpec[]): ParseOutcome {
  const all = [...specs, HELP];
  const positionals: string[] = [];
  const options: Record<string, string | true> = {};
  let help = false;
  let onlyPositionals = false;

  for (let i = 0; i < argv.length; i++) {
    const word = argv[i] ?? '';
    if (onlyPositionals || word === '-' || !word.startsWith('-')) {
      positionals.push(word);
      continue;
    }
    if (word === '--') {
      onlyPositionals = true;
      continue;
    }

    let spec: OptionSpec | undefined;
    let inline: string | undefined;
    let shown = word;
    if (word.startsWith('--')) {
      const eq = word.indexOf('=');
      const name = eq === -1 ? word.slice(2) : word.slice(2, eq);
      if (eq !== -1) inline = word.slice(eq + 1);
      shown = `--${name}`;
      spec = all.find((s) => s.name === name);
    } else {
      shown = word.slice(0, 2);
      spec = all.find((s) => s.short !== undefined && `-${s.short}` === shown);
      if (word.length > 2) inline = word.slice(2);
    }
    if (spec === undefined) return { ok: false, message: `unknown option ${shown}` };

    if (spec.value === undefined) {
      if (inline !== undefined) return { ok: false, message: `option ${shown} takes no value` };
      if (spec === HELP) help = true;
      else options[spec.name] = true;
      continue;
    }

    let value = inline;
    if (value === undefined) {
      const next = argv[i + 1];
      if (next === undefined || (next.startsWith('-') && next !== '-')) {
        return { ok: false, message: `option ${shown} needs a value (${spec.value})` };
      }
      value = next;
      i++;
    }
    if (spec.choices !== undefined && !spec.choices.includes(value)) {
      return {
        ok: false,
        message: `option ${shown} must be one of ${spec.choices.join(', ')}, got ${JSON.stringify(value)}`,
      };
    }
    if (options[spec.name] !== undefined) return { ok: false, message: `option ${shown} given twice` };
    options[spec.name] = value;
  }
  return { ok: true, args: { positionals, options, help } };
}

/** The option lines of a help text, aligned. */
export function describeOptions(specs: readonly OptionSpec[]): string[] {
  const rows = [...specs, HELP].map((s) => {
    const names = `${s.short !== undefined ? `-${s.short}, ` : '    '}--${s.name}${s.value !== undefined ? ` ${s.value}` : ''}`;
    const choices = s.choices !== undefined ? ` (${s.choices.join(' | ')})` : '';
    return [names, `${s.summary}${choices}`] as const;
  });
  const width = Math.max(...rows.map(([n]) => n.length));
  return rows.map(([n, text]) => `  ${n.padEnd(width)}  ${text}`);
}
