/**
 * `ionwright merge-sarif <file.sarif>...`: the SARIF logs that `check --shard i/n --format sarif` wrote in
 * n CI jobs, as one log to upload: one run, the rules of every input once (results pointed at them
 * again by index), every result, ordered by file as an unsharded check orders them (folders segment by
 * segment), and one invocation per input (the merged run is successful only if every input's was).
 * Only logs written by Ionwright are merged; anything else is a usage error naming the file.
 */
import { reasonOf, UsageError, type CliIO } from './io';
import { jsonText, OutputWriter, writeJsonArray } from './text';

interface Rule {
  id: string;
  [k: string]: unknown;
}
interface Result {
  ruleId?: string;
  ruleIndex?: number;
  locations?: Array<{ physicalLocation?: { artifactLocation?: { uri?: string }; region?: { startLine?: number; startColumn?: number } } }>;
  [k: string]: unknown;
}
interface Run {
  tool: { driver: { name: string; rules?: Rule[]; [k: string]: unknown } };
  results?: Result[];
  invocations?: unknown[];
  [k: string]: unknown;
}

function readLog(io: CliIO, path: string): Run[] {
  let text: string;
  try {
    text = io.readFile(path);
  } catch (e) {
    throw new UsageError(`${path}: cannot be read: ${reasonOf(e)}`);
  }
  let log: { version?: unknown; runs?: unknown };
  try {
    log = JSON.parse(text);
  } catch (e) {
    throw new UsageError(`${path}: not a SARIF log (${(e as Error).message.split('\n')[0]})`);
  }
  if (!log || log.version !== '2.1.0' || !Array.isArray(log.runs)) throw new UsageError(`${path}: not a SARIF 2.1.0 log`);
  for (const run of log.runs as Run[])
    if (run?.tool?.driver?.name !== 'ionwright') throw new UsageError(`${path}: a run of '${String(run?.tool?.driver?.name)}', not of ionwright`);
  return log.runs as Run[];
}

/** Artifact URIs compared as the check orders files: segment by segment. */
function uriOrder(a: string, b: string): number {
  const x = a.split('/');
  const y = b.split('/');
  for (let i = 0; i < Math.min(x.length, y.length); i++) {
    if (x[i] === y[i]) continue;
    const dx = decodeURIComponent(x[i]);
    const dy = decodeURIComponent(y[i]);
    return dx < dy ? -1 : dx > dy ? 1 : 0;
  }
  return x.length - y.length;
}

const uriOf = (r: Result) => r.locations?.[0]?.physicalLocation?.artifactLocation?.uri ?? '';

/** The merged log of several Ionwright SARIF logs. */
export function mergeSarif(runs: Run[]) {
  if (runs.length === 0) throw new UsageError('merge-sarif needs at least one SARIF file');
  const first = runs[0];
  const rules: Rule[] = [];
  const ruleIndex = new Map<string, number>();
  const results: Array<{ r: Result; file: string; order: number }> = [];
  const invocations: unknown[] = [];
  let order = 0;
  for (const run of runs) {
    const own = run.tool.driver.rules ?? [];
    for (const rule of own)
      if (!ruleIndex.has(rule.id)) {
        ruleIndex.set(rule.id, rules.length);
        rules.push(rule);
      }
    for (const r of run.results ?? []) {
      const id = r.ruleId ?? (r.ruleIndex !== undefined ? own[r.ruleIndex]?.id : undefined);
      const next: Result = { ...r };
      if (id !== undefined && ruleIndex.has(id)) next.ruleIndex = ruleIndex.get(id);
      results.push({ r: next, file: uriOf(r), order: order++ });
    }
    invocations.push(...(run.invocations ?? []));
  }
  // Stable: the results of one file keep their order.
  results.sort((a, b) => uriOrder(a.file, b.file) || a.order - b.order);
  const run: Run = {
    ...first,
    tool: { driver: { ...first.tool.driver, rules } },
    invocations,
    results: results.map((x) => x.r),
  };
  return { $schema: 'https://json.schemastore.org/sarif-2.1.0.json', version: '2.1.0' as const, runs: [run] };
}

/** Where the results go in the log's text (JSON escapes the NUL, so no path or message can be this). */
const RESULTS_MARK = '\\u0000results';

export async function cmdMergeSarif(args: string[], io: CliIO): Promise<number> {
  const files = args.filter((a) => a !== '--');
  const flag = files.find((a) => a.startsWith('-'));
  if (flag) throw new UsageError(`unknown flag '${flag}' for merge-sarif`);
  if (files.length === 0) throw new UsageError('merge-sarif needs at least one SARIF file');
  const log = mergeSarif(files.flatMap((f) => readLog(io, f)));
  // Written result by result, as check writes its SARIF: the log is never one string.
  const results = log.runs[0].results ?? [];
  (log.runs[0] as { results: unknown }).results = '\u0000results';
  const text = jsonText(log);
  const mark = `"results": "${RESULTS_MARK}"`;
  const at = text.indexOf(mark);
  const lineStart = text.lastIndexOf('\n', at) + 1;
  const w = new OutputWriter((t) => io.out(t));
  const p = w.line(text.slice(0, lineStart - 1));
  if (p) await p;
  await writeJsonArray(w, results, {
    indent: text.slice(lineStart, at),
    open: text.slice(lineStart, at + '"results": '.length),
    close: text.slice(at + mark.length),
  });
  await w.flush();
  return 0;
}
