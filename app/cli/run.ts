// The dispatcher: finds the command in the registry, parses its options, checks the
// number of arguments and runs it. Returns the exit status; writes only through `io`.

import { parseArgs } from './args.js';
import { EXIT, type Output } from './command.js';
import { COMMANDS } from './commands/index.js';
import { commandHelp, generalHelp, runPrefix } from './help.js';

export async function runCli(argv: readonly string[], io: Output): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined || first === 'help' || first === '--help' || first === '-h') {
    const topic = first === 'help' ? rest[0] : undefined;
    if (topic === undefined) {
      io.out(generalHelp(COMMANDS));
      return EXIT.ok;
    }
    const command = COMMANDS[topic];
    if (command === undefined) {
      io.err(`unknown command "${topic}"; commands: ${Object.keys(COMMANDS).join(', ')}, help\n`);
      return EXIT.unusable;
    }
    io.out(commandHelp(topic, command));
    return EXIT.ok;
  }

  const command = Object.hasOwn(COMMANDS, first) ? COMMANDS[first] : undefined;
  if (command === undefined) {
    io.err(`unknown command "${first}"; commands: ${Object.keys(COMMANDS).join(', ')}, help. Try \`${runPrefix()} --help\`.\n`);
    return EXIT.unusable;
  }
  const parsed = parseArgs(rest, command.options);
  if (!parsed.ok) {
    io.err(`${first}: ${parsed.message}. Usage: ${runPrefix()} ${command.usage}\n`);
    return EXIT.unusable;
  }
  if (parsed.args.help) {
    io.out(commandHelp(first, command));
    return EXIT.ok;
  }
  const count = parsed.args.positionals.length;
  const { min, max } = command.positionals;
  if (count < min || count > max) {
    const what = count < min ? 'missing argument' : `unexpected argument "${parsed.args.positionals[max] ?? ''}"`;
    io.err(`${first}: ${what}. Usage: ${runPrefix()} ${command.usage}\n`);
    return EXIT.unusable;
  }
  return command.run({ args: parsed.args, ...io });
}
