/**
 * A language-server session driven over stdio, as an editor drives it: open a note, type into it one
 * keystroke at a time (incremental changes), ask for a hover after each (so that every version is
 * analysed), close it; the server's resident memory is read from /proc. Used by the memory test and the
 * benchmarks.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import {
  createProtocolConnection,
  DidChangeTextDocumentNotification,
  DidCloseTextDocumentNotification,
  DidOpenTextDocumentNotification,
  ExitNotification,
  HoverRequest,
  InitializedNotification,
  InitializeRequest,
  ShutdownRequest,
  StreamMessageReader,
  StreamMessageWriter,
  type ProtocolConnection,
} from 'vscode-languageserver-protocol/node';

export interface Session {
  proc: ChildProcess;
  conn: ProtocolConnection;
  /** Resident set size of the server process, MB (Linux /proc). */
  rssMB(): number;
  open(uri: string, text: string, languageId?: string): Promise<void>;
  /** Type `n` characters at line `line`, one change each, with a hover after every change. */
  type(uri: string, n: number, line: number, chars?: string): Promise<void>;
  hover(uri: string, line: number, character: number): Promise<unknown>;
  close(uri: string): Promise<void>;
  stop(): Promise<void>;
}

export function rssOf(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const m = /VmRSS:\s+(\d+)\s+kB/.exec(status);
  return m ? Number(m[1]) / 1024 : NaN;
}

export async function startSession(serverJs: string, nodeArgs: string[] = []): Promise<Session> {
  const proc = spawn(process.execPath, [...nodeArgs, serverJs, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  proc.stderr!.resume();
  const conn = createProtocolConnection(new StreamMessageReader(proc.stdout!), new StreamMessageWriter(proc.stdin!));
  conn.onNotification('textDocument/publishDiagnostics', () => {});
  conn.listen();
  await conn.sendRequest(InitializeRequest.type, { processId: process.pid, rootUri: null, workspaceFolders: null, capabilities: {} });
  await conn.sendNotification(InitializedNotification.type, {});
  const versions = new Map<string, number>();
  const session: Session = {
    proc,
    conn,
    rssMB: () => rssOf(proc.pid!),
    async open(uri, text, languageId = 'markdown') {
      versions.set(uri, 1);
      await conn.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId, version: 1, text } });
      await session.hover(uri, 0, 0);
    },
    async type(uri, n, line, chars = 'NaCl ') {
      for (let i = 0; i < n; i++) {
        const version = (versions.get(uri) ?? 1) + 1;
        versions.set(uri, version);
        const character = i;
        await conn.sendNotification(DidChangeTextDocumentNotification.type, {
          textDocument: { uri, version },
          contentChanges: [{ range: { start: { line, character }, end: { line, character } }, text: chars[i % chars.length] }],
        });
        await session.hover(uri, line, character);
      }
    },
    hover: (uri, line, character) => conn.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line, character } }),
    async close(uri) {
      versions.delete(uri);
      await conn.sendNotification(DidCloseTextDocumentNotification.type, { textDocument: { uri } });
    },
    async stop() {
      try {
        await conn.sendRequest(ShutdownRequest.type);
        await conn.sendNotification(ExitNotification.type);
      } catch {
        // already gone
      }
      conn.dispose();
      if (proc.exitCode === null) proc.kill();
    },
  };
  return session;
}

/** Wait `ms` milliseconds. */
export const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));
