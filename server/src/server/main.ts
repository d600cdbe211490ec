/**
 * Entry of the language server on Node: `node dist/server.js --stdio` (or `--node-ipc` when started by
 * the VS Code client, `--socket=<port>`, `--pipe=<name>`). It chooses the transport, puts the lifecycle
 * gate in front of it, and starts the server.
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import {
  createConnection,
  createServerPipeTransport,
  createServerSocketTransport,
  IPCMessageReader,
  IPCMessageWriter,
  LSPErrorCodes,
  ProposedFeatures,
  StreamMessageReader,
  StreamMessageWriter,
  type MessageReader,
  type MessageWriter,
} from 'vscode-languageserver/node';
import { nodeFolderReader } from './folder';
import { lifecycleGate } from './lifecycle';
import { startServer } from './server';

function transport(argv: string[]): [MessageReader, MessageWriter] | undefined {
  for (let i = 0; i < argv.length; i++) {
    const [flag, value = argv[i + 1]] = argv[i].split('=');
    if (flag === '--stdio') return [new StreamMessageReader(process.stdin), new StreamMessageWriter(process.stdout)];
    if (flag === '--node-ipc') return [new IPCMessageReader(process), new IPCMessageWriter(process)];
    if (flag === '--socket' && value) return createServerSocketTransport(Number(value));
    if (flag === '--pipe' && value) return createServerPipeTransport(value);
  }
  return undefined;
}

/** The collector, where Node can expose it at run time; undefined otherwise. */
function collector(): (() => void) | undefined {
  try {
    let gc = (globalThis as { gc?: unknown }).gc;
    if (typeof gc !== 'function') {
      setFlagsFromString('--expose-gc');
      gc = runInNewContext('gc');
    }
    if (typeof gc !== 'function') return undefined;
    const collect = gc as (options?: { type: string; execution: string }) => void;
    // Marking runs alongside the server (V8's concurrent marker) rather than in one pause.
    return () => collect({ type: 'major', execution: 'async' });
  } catch {
    return undefined;
  }
}

const channel = transport(process.argv.slice(2));
if (!channel) {
  process.stderr.write('ionwright: the language server needs a transport: --stdio, --node-ipc, --socket=<port> or --pipe=<name>\n');
  process.exit(2);
}
const [rawReader, writer] = channel;
const { reader, lifecycle } = lifecycleGate(rawReader, writer, {
  log: (line) => process.stderr.write(line + '\n'),
  onFatal: () => process.exit(1),
});
// The client went away: end as the protocol says (0 after shutdown, else 1).
rawReader.onClose(() => process.exit(lifecycle.shutdownReceived ? 0 : 1));

const connection = createConnection(ProposedFeatures.all, reader, writer, {
  // A request cancelled before it was dispatched is answered at once, without running it.
  connectionStrategy: {
    cancelUndispatched: (message) => ({
      jsonrpc: '2.0',
      id: (message as unknown as { id: number | string }).id,
      error: { code: LSPErrorCodes.RequestCancelled, message: 'request cancelled' },
    }),
  },
});
// Over stdio, stdout is the protocol: anything a library prints goes to the log instead.
console.log = (...args: unknown[]) => connection.console.log(args.map(String).join(' '));
console.info = console.log;
console.warn = (...args: unknown[]) => connection.console.warn(args.map(String).join(' '));
console.error = (...args: unknown[]) => connection.console.error(args.map(String).join(' '));

startServer(connection, { collectGarbage: collector(), folder: nodeFolderReader });
