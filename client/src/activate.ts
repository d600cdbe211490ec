/**
 * What the VS Code client does wherever it runs — on the desktop (extension.ts: the server in a Node
 * process over IPC) and in VS Code for the Web (browserExtension.ts: the server in a Web Worker): start
 * the server with the first note open, register the commands (the code lens's weighing list among them),
 * and extend the built-in Markdown preview with Ionwright's markdown-it plugin. The entry hands over how
 * its language client is made.
 */
import * as vscode from 'vscode';
import type { BaseLanguageClient, LanguageClientOptions } from 'vscode-languageclient';
import type { MarkdownIt } from 'markdown-it';
import { readPreviewOptions } from '../../server/src/service/config';
import { ionwrightPreview, type PreviewOptions } from '../../server/src/service/preview';
import { WORKSPACE_REQUESTS } from '../../server/src/shared/commands';
import { CLIENT_COMMANDS, NOTES_LANGUAGES, checkScaleTarget, planCommand, resultMessage, SERVER_COMMANDS, withTarget, type EditorState } from './commands';
import { ServerLifecycle } from './lifecycle';

let lifecycleOfClient: ServerLifecycle | undefined;

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

/** Most notes the client lists for the server, and the largest it hands over (as the Node server reads them). */
const MAX_NOTES = 5000;
const MAX_NOTE_BYTES = 4 * 1024 * 1024;

/**
 * Read the workspace for a server that cannot (the browser build has no file system; a virtual
 * workspace's folders are no files on disk): the notes files under a folder, and one note's text,
 * through the editor's file system.
 */
function answerWorkspaceRequests(client: BaseLanguageClient) {
  client.onRequest(WORKSPACE_REQUESTS.listNotes, async (params: { folderUri?: unknown }) => {
    if (typeof params?.folderUri !== 'string') return [];
    const pattern = new vscode.RelativePattern(vscode.Uri.parse(params.folderUri), '**/*.{md,markdown,fnote}');
    const found = await vscode.workspace.findFiles(pattern, '{**/node_modules/**,**/.*/**}', MAX_NOTES);
    return found.map((u) => u.toString());
  });
  client.onRequest(WORKSPACE_REQUESTS.readNote, async (params: { uri?: unknown }) => {
    if (typeof params?.uri !== 'string') return null;
    try {
      const uri = vscode.Uri.parse(params.uri);
      if ((await vscode.workspace.fs.stat(uri)).size > MAX_NOTE_BYTES) return null;
      const text = new TextDecoder().decode(await vscode.workspace.fs.readFile(uri));
      return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
    } catch {
      return null;
    }
  });
}

export function activateIonwright(context: vscode.ExtensionContext, makeClient: (options: LanguageClientOptions) => BaseLanguageClient) {
  const output = vscode.window.createOutputChannel('Ionwright', { log: true });
  const clientOptions: LanguageClientOptions = {
    // The server reads nothing from disk to serve a note (the editor sends the text), so notes of any
    // scheme are served: files, untitled notes and virtual workspaces alike.
    documentSelector: NOTES_LANGUAGES.map((language) => ({ language })),
    outputChannel: output,
    // (The server registers its own watcher of the notes files, where the editor lets it.)
    synchronize: { configurationSection: 'ionwright' },
    // The client reads the workspace's notes for a server that cannot (the browser build; folders of a
    // virtual workspace): through the editor's file system.
    initializationOptions: { workspaceNotes: true },
  };
  const client = makeClient(clientOptions);
  answerWorkspaceRequests(client);

  // The server starts when the first note is open and stops a minute after the last one is closed.
  const lifecycle = new ServerLifecycle({
    start: () => client.start(),
    stop: () => client.stop(),
    openDocuments: () => vscode.workspace.textDocuments,
    setTimer: (fn, ms) => setTimeout(fn, ms),
    clearTimer: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
    log: (line) => output.info(line),
  });
  lifecycleOfClient = lifecycle;

  const runServerCommand = (command: string) => async () => {
    let plan = planCommand(command, editorState());
    if (plan.kind !== 'server') {
      void vscode.window.showWarningMessage(plan.message);
      return;
    }
    if (command === CLIENT_COMMANDS.scaleBatch) {
      const target = await vscode.window.showInputBox({
        title: 'Scale batch',
        prompt: 'A factor (×2, 0.5) or the new final volume or total mass (2 L, 500 mL, 5 kg); concentrations are kept',
        placeHolder: '2 L',
        validateInput: (text) => checkScaleTarget(text),
      });
      if (target === undefined) return;
      const planned = withTarget(plan, target);
      if (planned.kind !== 'server') return;
      plan = planned;
    }
    try {
      await lifecycle.ensureRunning();
      const result = await client.sendRequest('workspace/executeCommand', { command: plan.command, arguments: plan.args });
      if (command === CLIENT_COMMANDS.copyCard && typeof result === 'string') await vscode.env.clipboard.writeText(result);
      const msg = resultMessage(command, result);
      if (msg) void vscode.window.showInformationMessage(msg);
    } catch (e) {
      output.info(`${command} failed: ${(e as Error).message}`);
      void vscode.window.showErrorMessage(`Ionwright: ${(e as Error).message}`);
    }
  };

  /** The code lens above a batch: its weighing list, as plain text, to the clipboard. */
  const copyWeighingList = async (arg: unknown) => {
    try {
      await lifecycle.ensureRunning();
      const text = await client.sendRequest('workspace/executeCommand', { command: SERVER_COMMANDS.weighingList, arguments: [arg] });
      if (typeof text === 'string') await vscode.env.clipboard.writeText(text);
      const msg = resultMessage(CLIENT_COMMANDS.copyWeighingList, text);
      if (msg) void vscode.window.showInformationMessage(msg);
    } catch (e) {
      output.info(`${CLIENT_COMMANDS.copyWeighingList} failed: ${(e as Error).message}`);
      void vscode.window.showErrorMessage(`Ionwright: ${(e as Error).message}`);
    }
  };

  context.subscriptions.push(
    output,
    vscode.commands.registerCommand(CLIENT_COMMANDS.insertTable, runServerCommand(CLIENT_COMMANDS.insertTable)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.insertSectionTable, runServerCommand(CLIENT_COMMANDS.insertSectionTable)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.copyCard, runServerCommand(CLIENT_COMMANDS.copyCard)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.scaleBatch, runServerCommand(CLIENT_COMMANDS.scaleBatch)),
    vscode.commands.registerCommand(CLIENT_COMMANDS.copyWeighingList, copyWeighingList),
    vscode.commands.registerCommand(CLIENT_COMMANDS.restartServer, async () => {
      output.info('Restarting the Ionwright server.');
      if (lifecycle.isRunning) {
        await client.stop();
        await client.start();
      } else await lifecycle.ensureRunning();
    }),
    vscode.workspace.onDidOpenTextDocument(() => void lifecycle.update()),
    vscode.workspace.onDidCloseTextDocument(() => void lifecycle.update()),
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
  void lifecycle.update();

  return {
    extendMarkdownIt(md: MarkdownIt) {
      return md.use(ionwrightPreview, () => previewOptions);
    },
  };
}

export async function deactivateIonwright() {
  await lifecycleOfClient?.dispose();
}
