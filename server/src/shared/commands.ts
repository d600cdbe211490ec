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
} as const;

export const SERVER_COMMANDS = {
  insertTable: 'ionwright.server.insertTable',
  insertSectionTable: 'ionwright.server.insertSectionTable',
  insertTableAt: 'ionwright.server.insertTableAt',
  cardMarkdown: 'ionwright.server.cardMarkdown',
} as const;

/** The languages the server serves, as VS Code names them. */
export const NOTES_LANGUAGES = ['markdown', 'fnote'] as const;
