/**
 * The workspace folder's notes on Node (the browser build has no file system and does not import this):
 * `.md`, `.markdown` and `.fnote` files under a `file:` folder, hidden folders and node_modules skipped,
 * symbolic links not followed, at most MAX_FILES files of at most MAX_BYTES each, read one at a time so
 * that the server keeps answering the editor meanwhile. Only the server's index reads them; the notes
 * are never written.
 */
import { readdir, readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { FolderReader } from './notesIndex';

export const MAX_FILES = 5000;
export const MAX_BYTES = 4 * 1024 * 1024;

const isNote = (name: string) => /\.(md|markdown|fnote)$/i.test(name);

async function readNote(path: string): Promise<string | undefined> {
  try {
    const s = await stat(path);
    if (!s.isFile() || s.size > MAX_BYTES) return undefined;
    const text = await readFile(path, 'utf8');
    return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  } catch {
    return undefined;
  }
}

async function* walk(dir: string, budget: { files: number }): AsyncGenerator<string> {
  let entries;
  try {
    entries = await readdir(dir, { withFileTypes: true });
  } catch {
    return;
  }
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const e of entries) {
    if (budget.files <= 0) return;
    if (e.name.startsWith('.') || e.name === 'node_modules') continue;
    const p = join(dir, e.name);
    if (e.isDirectory()) yield* walk(p, budget);
    else if (e.isFile() && isNote(e.name)) {
      budget.files--;
      yield p;
    }
  }
}

export const nodeFolderReader: FolderReader = {
  async *notes(folderUri) {
    if (!folderUri.startsWith('file:')) return;
    let root: string;
    try {
      root = fileURLToPath(folderUri);
    } catch {
      return;
    }
    for await (const path of walk(root, { files: MAX_FILES })) {
      const text = await readNote(path);
      if (text !== undefined) yield { uri: pathToFileURL(path).href, text };
    }
  },
  async read(uri) {
    if (!uri.startsWith('file:') || !isNote(uri)) return undefined;
    try {
      return await readNote(fileURLToPath(uri));
    } catch {
      return undefined;
    }
  },
};
