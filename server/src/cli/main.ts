/**
 * The command line: the language service over files. All IO is here; the service is pure.
 * Exit status: 0 ran without error-severity findings; 1 ran with them; 2 usage or input problem
 * (one line on stderr, never a stack trace); 141 when the reader of stdout went away early (nothing
 * more is printed).
 *
 * Everything a command prints goes through `visibleText` (text.ts): control characters from the notes
 * or from file names reach the terminal as visible pictures, never as escape sequences.
 */
import { createLanguageService } from '../service/languageService';
import { cmdCheck } from './check';
import { cmdMergeSarif } from './sarifMerge';
import { extraCommands } from './commands';
import { asksForHelp, COMMAND_HELP, OVERVIEW } from './help';
import { EXIT_OUTPUT_CLOSED, nodeIO, OutputClosed, parse, UsageError, type CliIO } from './io';
import { jsonText, visibleLine, visibleText } from './text';
import { VERSION } from './version';

export { nodeIO, type CliIO };

function cmdCard(args: string[], io: CliIO): number {
  const { values, positionals } = parse(args, { json: { type: 'boolean' } });
  if (positionals.length === 0) throw new UsageError('card needs at least one formula');
  const service = createLanguageService();
  if (values.json) io.out(jsonText(positionals.map((p) => service.cardJson(p))));
  else io.out(positionals.map((p) => service.cardText(p)).join('\n\n'));
  return positionals.some((p) => service.formula(p).diagnostics.some((d) => d.severity === 'error')) ? 1 : 0;
}

const builtIn: Record<string, (args: string[], io: CliIO) => number | Promise<number>> = { card: cmdCard, check: cmdCheck, 'merge-sarif': cmdMergeSarif };

/** The IO a command sees: what it prints made safe for a terminal. */
function shown(io: CliIO): CliIO {
  return Object.assign(Object.create(io) as CliIO, {
    out: (t: string) => io.out(visibleText(t)),
    err: (t: string) => io.err(visibleText(t)),
  });
}

export async function run(argv: string[], outer: CliIO = nodeIO): Promise<number> {
  const io = shown(outer);
  try {
    const [command, ...rest] = argv;
    switch (command) {
      case undefined:
        throw new UsageError('no command given (try: ionwright --help)');
      case '--help':
      case '-h':
      case 'help': {
        const topic = command === 'help' ? rest[0] : undefined;
        if (topic !== undefined && !Object.hasOwn(COMMAND_HELP, topic)) throw new UsageError(`unknown command '${topic}' (try: ionwright --help)`);
        io.out(topic ? COMMAND_HELP[topic] : OVERVIEW);
        return 0;
      }
      case '--version':
        io.out(`ionwright ${VERSION}`);
        return 0;
      default: {
        if (Object.hasOwn(COMMAND_HELP, command) && asksForHelp(rest)) {
          io.out(COMMAND_HELP[command]);
          return 0;
        }
        const handler = Object.hasOwn(builtIn, command) ? builtIn[command] : Object.hasOwn(extraCommands, command) ? extraCommands[command] : undefined;
        if (!handler) throw new UsageError(`unknown command '${command}' (try: ionwright --help)`);
        return await handler(rest, io);
      }
    }
  } catch (e) {
    if (e instanceof OutputClosed) return EXIT_OUTPUT_CLOSED;
    if (e instanceof UsageError) {
      io.err(`ionwright: ${visibleLine(e.message)}`);
      return 2;
    }
    io.err(`ionwright: internal error: ${visibleLine((e as Error)?.message?.split('\n')[0] ?? String(e))}`);
    return 2;
  }
}
