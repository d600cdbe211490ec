/**
 * Client-side command logic that needs no VS Code: which server command to call with which arguments.
 * extension.ts feeds it the active editor's state.
 */
import { CLIENT_COMMANDS, NOTES_LANGUAGES, SERVER_COMMANDS } from '../../server/src/shared/commands';

export { CLIENT_COMMANDS, NOTES_LANGUAGES, SERVER_COMMANDS };

export interface EditorState {
  uri: string;
  languageId: string;
  selection: { start: { line: number; character: number }; end: { line: number; character: number } };
}

export type Plan = { kind: 'server'; command: string; args: unknown[] } | { kind: 'error'; message: string };

/** What a client command asks of the server, for the editor state it runs in. */
export function planCommand(command: string, editor: EditorState | undefined): Plan {
  if (!editor) return { kind: 'error', message: 'Open a Markdown or .fnote notes file first.' };
  if (!(NOTES_LANGUAGES as readonly string[]).includes(editor.languageId))
    return { kind: 'error', message: `Ionwright works on Markdown and .fnote notes, not on '${editor.languageId}' files.` };
  const { uri, selection } = editor;
  switch (command) {
    case CLIENT_COMMANDS.insertTable:
      return { kind: 'server', command: SERVER_COMMANDS.insertTable, args: [{ uri, range: selection }] };
    case CLIENT_COMMANDS.insertSectionTable:
      return { kind: 'server', command: SERVER_COMMANDS.insertSectionTable, args: [{ uri, position: selection.start }] };
    case CLIENT_COMMANDS.copyCard:
      return { kind: 'server', command: SERVER_COMMANDS.cardMarkdown, args: [{ uri, position: selection.start }] };
    case CLIENT_COMMANDS.scaleBatch:
      return { kind: 'server', command: SERVER_COMMANDS.scaleBatch, args: [{ uri, position: selection.start }] };
    default:
      return { kind: 'error', message: `Unknown command ${command}.` };
  }
}

/** The message to show after a server command ran. */
export function resultMessage(command: string, result: unknown): string | undefined {
  if (command === CLIENT_COMMANDS.copyWeighingList) return typeof result === 'string' ? 'Ionwright weighing list copied as plain text.' : 'No batch here.';
  if (command === CLIENT_COMMANDS.copyCard) return typeof result === 'string' ? 'Ionwright card copied as Markdown.' : 'No formula under the cursor.';
  const r = result as { applied?: boolean; reason?: string } | null;
  if (!r) return command === CLIENT_COMMANDS.scaleBatch ? 'No batch here.' : 'Nothing to tabulate here.';
  if (r.applied === false) return r.reason ? `Ionwright: ${r.reason}.` : 'The edit was not applied.';
  return undefined;
}

/** What the input box of "Scale batch…" accepts; undefined when it is fine, else the message to show. */
export function checkScaleTarget(text: string): string | undefined {
  const t = text.trim().replace(/,/g, '.');
  if (/^(?:[×x*]\s*)?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*(?:[×x])?$/.test(t))
    return Number(t.replace(/[^\d.eE+-]/g, '')) > 0 ? undefined : 'The factor must be above zero.';
  if (/^(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*(?:µL|uL|mL|ml|L|l|mg|g|kg)$/.test(t)) return undefined;
  return 'A factor (×2, 0.5) or a new size (2 L, 500 mL, 5 kg).';
}

/** The server command's arguments with the target the user typed. */
export function withTarget(plan: Plan, target: string): Plan {
  if (plan.kind !== 'server') return plan;
  return { ...plan, args: [{ ...(plan.args[0] as object), target: target.trim() }] };
}
