/**
 * The VS Code client in VS Code for the Web (package.json `browser`): the Ionwright language server runs
 * in a Web Worker (dist/browser/server.js), spoken to with JSON-RPC messages. The server has no file
 * system there: this client reads the workspace's notes for it (through the editor's file system, so
 * virtual workspaces too), for workspace symbols and definitions. Everything else is shared with the
 * desktop entry (activate.ts).
 */
import * as vscode from 'vscode';
import { LanguageClient } from 'vscode-languageclient/browser';
import { activateIonwright, deactivateIonwright } from './activate';

/** The extension host's Worker (typed here: the sources are compiled without the DOM library). */
declare const Worker: new (url: string) => ConstructorParameters<typeof LanguageClient>[3];

export function activate(context: vscode.ExtensionContext) {
  const serverMain = vscode.Uri.joinPath(context.extensionUri, 'dist', 'browser', 'server.js');
  return activateIonwright(context, (clientOptions) => new LanguageClient('ionwright', 'Ionwright', clientOptions, new Worker(serverMain.toString(true))));
}

export const deactivate = deactivateIonwright;
