/** The VS Code client: starts the Ionwright language server over IPC. */
import * as path from 'node:path';
import type { ExtensionContext } from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';

let client: LanguageClient | undefined;

export async function activate(context: ExtensionContext) {
  const module = context.asAbsolutePath(path.join('dist', 'server.js'));
  const serverOptions: ServerOptions = {
    run: { module, transport: TransportKind.ipc },
    debug: { module, transport: TransportKind.ipc, options: { execArgv: ['--nolazy', '--inspect=6019'] } },
  };
  const clientOptions: LanguageClientOptions = {
    documentSelector: [
      { scheme: 'file', language: 'markdown' },
      { scheme: 'file', language: 'fnote' },
      { scheme: 'untitled', language: 'markdown' },
      { scheme: 'untitled', language: 'fnote' },
    ],
  };
  client = new LanguageClient('ionwright', 'Ionwright', serverOptions, clientOptions);
  await client.start();
}

export async function deactivate() {
  await client?.stop();
}
