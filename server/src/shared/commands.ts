/**
 * Command ids, in one place for the VS Code client and the language server: the client's commands (in
 * package.json `contributes.commands`) and the server's (`workspace/executeCommand`), which the client's
 * commands call.
 */
export const CLIENT_COMMANDS = {
  insertTable: 'ionwright.insertTable',
  insertSectionTable: 'ionwright.insertSectionTable',
  copyCard: 'ionwright.copyCard',
  restartServer: 'ionwright.restartServer',
  showOutput: 'ionwright.showOutput',
  /** The code lens above a batch: copy it as a weighing list (arguments: `{uri, position}`). */
  copyWeighingList: 'ionwright.copyWeighingList',
  /** Scale the batch at the cursor to a new size (asked for in an input box). */
  scaleBatch: 'ionwright.scaleBatch',
} as const;

export const SERVER_COMMANDS = {
  insertTable: 'ionwright.server.insertTable',
  insertSectionTable: 'ionwright.server.insertSectionTable',
  insertTableAt: 'ionwright.server.insertTableAt',
  cardMarkdown: 'ionwright.server.cardMarkdown',
  /** The batch at `{uri, position}` as a weighing list (plain text), or null. */
  weighingList: 'ionwright.server.weighingList',
  /** Scale the batch at `{uri, position}` to `{target}` (`×2`, `2 L`, `5 kg`): applies the edit, `{applied, reason?}`. */
  scaleBatch: 'ionwright.server.scaleBatch',
} as const;

/** The languages the server serves, as VS Code names them. */
export const NOTES_LANGUAGES = ['markdown', 'fnote'] as const;

/**
 * Requests the server sends a client that offers to read the workspace for it (initialization option
 * `workspaceNotes: true`; the browser client does, since the server has no file system there):
 * `listNotes` `{folderUri}` → the URIs of the notes files under the folder; `readNote` `{uri}` → the text,
 * or null.
 */
export const WORKSPACE_REQUESTS = {
  listNotes: 'ionwright/listNotes',
  readNote: 'ionwright/readNote',
} as const;
