/**
 * The VS Code client: starts the Ionwright language server over IPC, registers the commands, and extends
 * the built-in Markdown preview with Ionwright's markdown-it plugin.
 */
import * as path from 'node:path';
import * as vscode from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';
import type { MarkdownIt } from 'markdown-it';
import { readPreviewOptions } from '../../server/src/service/config';
import { ionwrightPreview, type PreviewOptions } from '../../server/src/service/preview';
import { CLIENT_COMMANDS, NOTES_LANGUAGES, planCommand, resultMessage, type EditorState } from './commands';

let client: LanguageClient | undefined;

function editorState(): EditorState | undefined {
  const e = vscode.window.activeTextEditor;
  if (!e) return undefined;
  const s = e.selection;
  return {
    uri: e.document.uri.toString(),
    languageId: e.document.languageId,
    selection: { start: { line: s.start.line, character: s.start.character }, end: { line: s.end.line, character: s.end.character } },
  };
}

export function activate(context: vscode.ExtensionContext) {
  const output = vscode.window.createOutputChannel('Ionwright', { log: true });
  const module = context.asAbsolutePath(path.join('dist', 'server.js'));
  const serverOptions: ServerOptions = {
    run: { module, transport: TransportKind.ipc },
    debug: { module, transport: TransportKind.ipc, options: { execArgv: ['--nolazy', '--inspect=6019'] } },
  };
  const clientOptions: LanguageClientOptions = {
    documentSelector: NOTES_LANGUAGES.flatMap((language) => [{ scheme: 'file', language }, { scheme: 'untitled', language }]),
    outputChannel: output,
    synchronize: { configurationSection: 'ionwright' },
  };
  client = new LanguageClient('ionwright', 'Ionwright', serverOptions, clientOptions);

  const runServerCommand = (command: string) => async () => {
    const plan = planCommand(command, editorState());
    if (plan.kind === 'error') {
      void vscode.window.showWarningMessage(plan.message);
      return;
    }
    try {
      const result = await client?.sendRequest('workspace/executeCommand', { command: plan.command, arguments: plan.args });
      if (command === CLIENT_COMMANDS.copyCard && typeof result === 'string') await vscode.env.clipboard.writeText(result);
      const msg = resultMessage(command, result);
      if (msg) void vscode.window.showInformationMessage(msg);
    } catch (e) {
      output.info(`${command} failed: ${(e as Error).message}`);
      void vscode.window.showErrorMessage(`Ionwright: ${(e as Error).message}`);
    }
  };

  context.subscriptions.push(
    output,
    vscode.commands.registerCommand(CLIENT_COMMANDS.insertTable, runServerCommand(CLIENT_COMMANDS.insertTable)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.insertSectionTable, runServerCommand(CLIENT_COMMANDS.insertSectionTable)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.copyCard, runServerCommand(CLIENT_COMMANDS.copyCard)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.restartServer, async () => {
      output.info('Restarting the Ionwright server.');
      await client?.restart();
    }),
    vscode.commands.registerCommand(CLIENT_COMMANDS.showOutput, () => output.show(true)),
  );
  // The preview reads the settings once per change, not once per render.
  let previewOptions: PreviewOptions = readPreviewOptions(vscode.workspace.getConfiguration().get('ionwright'));
  context.subscriptions.push(
    vscode.workspace.onDidChangeConfiguration((e) => {
      if (!e.affectsConfiguration('ionwright')) return;
      previewOptions = readPreviewOptions(vscode.workspace.getConfiguration().get('ionwright'));
      void vscode.commands.executeCommand('markdown.preview.refresh');
    }),
  );

  // Not awaited: the preview plugin must not wait for the server.
  client.start().then(
    () => output.info('Ionwright server started.'),
    (e) => output.info(`The Ionwright server did not start: ${(e as Error).message}`),
  );

  return {
    extendMarkdownIt(md: MarkdownIt) {
      return md.use(ionwrightPreview, () => previewOptions);
    },
  };
}

export async function deactivate() {
  await client?.stop();
}
