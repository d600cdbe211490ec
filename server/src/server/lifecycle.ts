/**
 * The LSP 3.17 lifecycle, enforced where messages enter the server (any transport: stdio, IPC, a Web
 * Worker's messages), before the protocol library sees them:
 *
 * - before `initialize`: a request is answered with ServerNotInitialized (-32002); a notification is
 *   dropped, except `exit`;
 * - a second `initialize` is answered with InvalidRequest (-32600);
 * - after `shutdown`: a request is answered with InvalidRequest; a notification other than `exit` is
 *   dropped;
 * - a message the transport cannot read (a frame with a missing or malformed Content-Length, a body that
 *   is not JSON) is logged, and the server ends with a failure status (`onFatal`), so that the client
 *   starts a new one instead of talking to a server that can no longer find the next message.
 */
import { ErrorCodes, type DataCallback, type Message, type MessageReader, type MessageWriter, type RequestMessage } from 'vscode-languageserver';

export type LifecycleState = 'new' | 'initializing' | 'running' | 'shut-down';

export interface Lifecycle {
  readonly state: LifecycleState;
  readonly shutdownReceived: boolean;
}

export interface GateOptions {
  /** Where the gate writes what it logs (a line, no newline). */
  log(line: string): void;
  /** End the server with a failure status; called once, after the log line. */
  onFatal(): void;
}

const isRequest = (m: Message): m is RequestMessage => typeof (m as RequestMessage).method === 'string' && 'id' in m && (m as RequestMessage).id !== undefined;
const isNotification = (m: Message): m is Message & { method: string } =>
  typeof (m as { method?: unknown }).method === 'string' && !('id' in m && (m as RequestMessage).id !== undefined);

/** A reader that lets through only what the lifecycle allows, answering the rest itself. */
export function lifecycleGate(inner: MessageReader, writer: MessageWriter, options: GateOptions): { reader: MessageReader; lifecycle: Lifecycle } {
  let state: LifecycleState = 'new';
  let fatal = false;
  const lifecycle: Lifecycle = {
    get state() {
      return state;
    },
    get shutdownReceived() {
      return state === 'shut-down';
    },
  };
  const refuse = (m: RequestMessage, code: number, message: string) => {
    void writer.write({ jsonrpc: '2.0', id: m.id, error: { code, message } } as Message).catch(() => undefined);
  };

  inner.onError((error) => {
    if (fatal) return;
    fatal = true;
    const what = error?.message?.split('\n')[0] ?? String(error);
    options.log(`ionwright: the client sent a message that cannot be read (${what}); the server stops so that the client can start a new one.`);
    options.onFatal();
  });

  const reader: MessageReader = {
    onError: inner.onError,
    onClose: inner.onClose,
    onPartialMessage: inner.onPartialMessage,
    dispose: () => inner.dispose(),
    listen(callback: DataCallback) {
      // A message the library cannot handle (it throws on some malformed ones) is logged and dropped;
      // it must not reach the reader's error event, which ends the server.
      const deliver = (m: Message) => {
        try {
          callback(m);
        } catch (e) {
          options.log(`ionwright: a ${(m as { method?: string }).method ?? 'response'} message was dropped: ${(e as Error)?.message ?? String(e)}`);
        }
      };
      return inner.listen((m: Message) => {
        if (fatal) return;
        if (isNotification(m) && m.method === '$/cancelRequest') {
          const id = (m as { params?: { id?: unknown } }).params?.id;
          if (typeof id !== 'number' && typeof id !== 'string') return options.log('ionwright: a $/cancelRequest without an id was dropped.');
        }
        if (isRequest(m)) {
          if (m.method === 'initialize') {
            if (state !== 'new') return refuse(m, ErrorCodes.InvalidRequest, 'initialize was already received: a server is initialised once');
            state = 'initializing';
            // A client that sends no capabilities (or no params) has none: say so, rather than fail on it.
            const params = m.params && typeof m.params === 'object' && !Array.isArray(m.params) ? (m.params as Record<string, unknown>) : {};
            if (!params.capabilities || typeof params.capabilities !== 'object')
              return deliver({ ...m, params: { processId: null, rootUri: null, ...params, capabilities: {} } } as Message);
            return deliver(m);
          }
          if (state === 'new') return refuse(m, ErrorCodes.ServerNotInitialized, `${m.method} before initialize: the server is not initialised yet`);
          if (state === 'shut-down') return refuse(m, ErrorCodes.InvalidRequest, `${m.method} after shutdown: only the exit notification is accepted now`);
          if (m.method === 'shutdown') state = 'shut-down';
          return deliver(m);
        }
        if (isNotification(m)) {
          if (m.method === 'exit') return deliver(m);
          if (state === 'new' || state === 'shut-down') return;
          if (m.method === 'initialized') state = 'running';
          return deliver(m);
        }
        // Responses to the server's own requests.
        return deliver(m);
      });
    },
  };
  return { reader, lifecycle };
}
