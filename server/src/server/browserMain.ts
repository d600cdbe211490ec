/**
 * Entry of the language server in a Web Worker (VS Code for the Web, or any host that posts JSON-RPC
 * message objects to the worker): `dist/browser/server.js`. The same lifecycle gate and the same server
 * as on Node (main.ts), over the worker's messages. What differs: no garbage collection on request, and
 * no file system, so the workspace the server indexes is the notes the editor has open.
 */
import { BrowserMessageReader, BrowserMessageWriter, createConnection } from 'vscode-languageserver/browser';
import { lifecycleGate } from './lifecycle';
import { startServer } from './server';

/** The worker's global scope (typed without the DOM library, which the sources do not load). */
declare const self: ConstructorParameters<typeof BrowserMessageReader>[0] & { close(): void };

const rawReader = new BrowserMessageReader(self);
const writer = new BrowserMessageWriter(self);
// Until the connection exists, what the gate logs goes to the worker's console; then to the client's log.
let log = (line: string) => console.error(line);
const { reader } = lifecycleGate(rawReader, writer, {
  log: (line) => log(line),
  // A worker cannot exit with a status: it closes, and the client sees the connection end.
  onFatal: () => self.close(),
});

const connection = createConnection(reader, writer);
log = (line) => connection.console.error(line);
startServer(connection);
