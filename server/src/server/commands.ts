/**
 * `workspace/executeCommand`: the server's commands. Table insertion computes an edit on the analysed
 * version of the note and asks the client to apply it (`workspace/applyEdit`), tagged with that version
 * wherever the client can check it, so that an edit computed on an old text is never applied to a new one.
 */
import { ErrorCodes, ResponseError, type Connection, type ExecuteCommandParams } from 'vscode-languageserver';
import { createLanguageService, type EditOutcome, type TextEdit } from '../service/languageService';
import { SERVER_COMMANDS } from '../shared/commands';
import { invalidParams, isPosition, isRange } from './requests';
import type { NotesWorkspace, Snapshot } from './workspace';
import type { EditShape } from './server';

export interface CommandResult {
  applied: boolean;
  reason?: string;
}

export function commandHandler(connection: Connection, workspace: NotesWorkspace, shape: EditShape) {
  const snapshotFor = (uri: unknown): Snapshot | undefined => (typeof uri === 'string' ? workspace.snapshot(uri) : undefined);

  const apply = async (snap: Snapshot, outcome: EditOutcome | { edits: TextEdit[] }, label: string): Promise<CommandResult> => {
    if ('reason' in outcome) return { applied: false, reason: outcome.reason };
    const edits = 'edits' in outcome ? outcome.edits : [outcome.edit];
    // Without a versioned edit the client cannot refuse a stale one: check here, just before sending.
    if (!shape.versioned && workspace.versionOf(snap.uri) !== snap.version)
      return { applied: false, reason: 'the note changed while the edit was computed; run the command again' };
    const r = await connection.workspace.applyEdit({ label, edit: shape.edit(snap, edits) });
    if (r.applied) return { applied: true };
    return {
      applied: false,
      reason: r.failureReason
        ? `the editor did not apply the edit (${r.failureReason})`
        : 'the editor did not apply the edit (the note may have changed; run the command again)',
    };
  };

  return async (params: ExecuteCommandParams): Promise<unknown> => {
    const arg = (params.arguments?.[0] ?? {}) as { uri?: unknown; position?: unknown; range?: unknown; formula?: unknown; target?: unknown };
    switch (params.command) {
      case SERVER_COMMANDS.cardMarkdown: {
        if (typeof arg.formula === 'string') return createLanguageService(workspace.defaults.service).cardMarkdown(arg.formula);
        if (!isPosition(arg.position)) throw invalidParams('cardMarkdown needs {formula} or {uri, position}');
        const snap = snapshotFor(arg.uri);
        return snap ? snap.service.cardMarkdownAt(snap.doc, arg.position) : null;
      }
      case SERVER_COMMANDS.insertTable: {
        if (typeof arg.uri !== 'string' || !isRange(arg.range)) throw invalidParams('insertTable needs {uri, range}');
        const snap = snapshotFor(arg.uri);
        if (!snap) return null;
        return apply(snap, snap.service.tableEdit(snap.doc, { selection: arg.range }), 'Insert Ionwright table');
      }
      case SERVER_COMMANDS.insertSectionTable:
      case SERVER_COMMANDS.insertTableAt: {
        if (typeof arg.uri !== 'string' || !isPosition(arg.position)) throw invalidParams(`${params.command} needs {uri, position}`);
        const snap = snapshotFor(arg.uri);
        if (!snap) return null;
        return params.command === SERVER_COMMANDS.insertSectionTable
          ? apply(snap, snap.service.tableEdit(snap.doc, { section: arg.position }), 'Insert Ionwright section tables')
          : apply(snap, snap.service.tableEdit(snap.doc, { at: arg.position }), 'Insert Ionwright table');
      }
      case SERVER_COMMANDS.scaleBatch: {
        if (typeof arg.uri !== 'string' || !isPosition(arg.position) || typeof arg.target !== 'string')
          throw invalidParams('scaleBatch needs {uri, position, target}');
        const snap = snapshotFor(arg.uri);
        if (!snap) return null;
        const outcome = snap.service.scaleBatchEdit(snap.doc, arg.position, arg.target);
        return apply(snap, outcome, 'Scale Ionwright batch');
      }
      case SERVER_COMMANDS.weighingList: {
        if (typeof arg.uri !== 'string' || !isPosition(arg.position)) throw invalidParams('weighingList needs {uri, position}');
        const snap = snapshotFor(arg.uri);
        return snap ? snap.service.weighingListAt(snap.doc, arg.position) : null;
      }
      default:
        throw new ResponseError(ErrorCodes.MethodNotFound, `unknown command ${String(params.command)}`);
    }
  };
}
