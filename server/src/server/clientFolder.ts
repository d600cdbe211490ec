/**
 * The workspace folder read through the client, for a server that has no file system (the browser
 * build): the client lists the notes files (`ionwright/listNotes`) and hands over their text
 * (`ionwright/readNote`). Used only where the client offered it (initialization option
 * `workspaceNotes: true`). A request the client fails is taken as no notes: the open notes are then the
 * workspace.
 */
import type { Connection } from 'vscode-languageserver';
import { WORKSPACE_REQUESTS } from '../shared/commands';
import type { FolderReader } from './notesIndex';

/** Most notes read through the client (as on Node: folder.ts). */
const MAX_FILES = 5000;

export function clientFolderReader(connection: Connection): FolderReader {
  const read = async (uri: string): Promise<string | undefined> => {
    try {
      const text: unknown = await connection.sendRequest(WORKSPACE_REQUESTS.readNote, { uri });
      return typeof text === 'string' ? text : undefined;
    } catch {
      return undefined;
    }
  };
  return {
    async *notes(folderUri) {
      let uris: unknown;
      try {
        uris = await connection.sendRequest(WORKSPACE_REQUESTS.listNotes, { folderUri });
      } catch {
        return;
      }
      if (!Array.isArray(uris)) return;
      for (const uri of uris.slice(0, MAX_FILES)) {
        if (typeof uri !== 'string') continue;
        const text = await read(uri);
        if (text !== undefined) yield { uri, text };
      }
    },
    read,
  };
}
