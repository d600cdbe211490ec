/**
 * The VS Code client on the desktop: the Ionwright language server runs in a Node process of its own,
 * over IPC (dist/server.js). Everything else is shared with the browser entry (activate.ts).
 */
import * as path from 'node:path';
import type * as vscode from 'vscode';
import { LanguageClient, TransportKind, type ServerOptions } from 'vscode-languageclient/node';
import { activateIonwright, deactivateIonwright } from './activate';

export function activate(context: vscode.ExtensionContext) {
  const module = context.asAbsolutePath(path.join('dist', 'server.js'));
  const serverOptions: ServerOptions = {
    run: { module, transport: TransportKind.ipc },
    debug: { module, transport: TransportKind.ipc, options: { execArgv: ['--nolazy', '--inspect=6019'] } },
  };
  return activateIonwright(context, (clientOptions) => new LanguageClient('ionwright', 'Ionwright', serverOptions, clientOptions));
}

export const deactivate = deactivateIonwright;
