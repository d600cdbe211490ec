/**
 * The features for typing and finding one's way: completion, inlay hints, semantic tokens, folding
 * ranges, workspace symbols and definitions. Each request is checked, honours cancellation and is computed
 * by the language service (requests.ts wraps them); the workspace's notes come from the index.
 */
import type { Connection } from 'vscode-languageserver';
import { invalidParams, isRange, positionOf, uriOf, type makeRequestWrapper } from './requests';
import type { NotesIndex } from './notesIndex';
import type { NotesWorkspace } from './workspace';

type RequestWrapper = ReturnType<typeof makeRequestWrapper>;

export function registerEditingFeatures(connection: Connection, workspace: NotesWorkspace, index: NotesIndex, request: RequestWrapper) {
  connection.onCompletion(
    request('completion', (params) => {
      const uri = uriOf(params);
      const position = positionOf(params);
      const snap = workspace.snapshot(uri);
      if (!snap) return null;
      return snap.service.completion(snap.doc, position, index.vocabularyExcept(uri)) as never;
    }),
  );

  connection.languages.inlayHint.on(
    request('inlayHint', (params) => {
      const uri = uriOf(params);
      if (!isRange(params.range)) throw invalidParams('range must be {start, end} positions');
      const snap = workspace.snapshot(uri);
      if (!snap || !workspace.settingsOf(uri).inlayHints) return null;
      return snap.service.inlayHints(snap.doc, params.range) as never;
    }),
  );

  connection.languages.semanticTokens.on(
    request('semanticTokens', (params) => {
      const snap = workspace.snapshot(uriOf(params));
      return snap ? snap.service.semanticTokens(snap.doc) : { data: [] };
    }),
  );
  connection.languages.semanticTokens.onRange(
    request('semanticTokensRange', (params) => {
      const uri = uriOf(params);
      if (!isRange(params.range)) throw invalidParams('range must be {start, end} positions');
      const snap = workspace.snapshot(uri);
      return snap ? snap.service.semanticTokens(snap.doc, params.range) : { data: [] };
    }),
  );

  connection.onFoldingRanges(
    request('foldingRange', (params) => {
      const snap = workspace.snapshot(uriOf(params));
      return snap ? snap.service.foldingRanges(snap.doc) : null;
    }),
  );

  connection.onWorkspaceSymbol(
    request('workspaceSymbol', (params) => {
      const query = (params as { query?: unknown } | null)?.query ?? '';
      if (typeof query !== 'string') throw invalidParams('query must be a string');
      return workspace.defaultService.workspaceSymbols(index.summaries(), query) as never;
    }),
  );

  connection.onDefinition(
    request('definition', (params) => {
      const uri = uriOf(params);
      const position = positionOf(params);
      const snap = workspace.snapshot(uri);
      if (!snap) return null;
      return snap.service.definition(snap.doc, position, index.summaries(), snap.uri) as never;
    }),
  );
}
