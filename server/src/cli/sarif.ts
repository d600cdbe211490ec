/** SARIF 2.1.0 output for `check --format sarif` (OASIS SARIF v2.1.0, columns in UTF-16 code units). */
import type { LspDiagnostic } from '../service/diagnostics';

const LEVEL = { 1: 'error', 2: 'warning', 3: 'note', 4: 'note' } as const;

const RULES: Record<string, string> = {
  'unknown-element': 'A symbol that is no element.',
  'malformed-formula': 'A formula that cannot be read: unbalanced brackets, stray characters, impossible counts.',
  'charge-imbalance': 'A neutral formula whose ions or oxidation states cannot sum to zero, or an ion whose written charge disagrees with its composition.',
  'unbalanced-equation': 'A reaction whose atoms or charges differ between the sides.',
};

export function toSarif(files: Array<{ path: string; diagnostics: LspDiagnostic[] }>) {
  const codes = new Set<string>(Object.keys(RULES));
  for (const f of files) for (const d of f.diagnostics) codes.add(d.code);
  const rules = [...codes].map((id) => ({ id, shortDescription: { text: RULES[id] ?? id } }));
  return {
    $schema: 'https://json.schemastore.org/sarif-2.1.0.json',
    version: '2.1.0',
    runs: [
      {
        tool: { driver: { name: 'ionwright', version: '0.1.0', rules } },
        columnKind: 'utf16CodeUnits',
        results: files.flatMap((f) =>
          f.diagnostics.map((d) => ({
            ruleId: d.code,
            level: LEVEL[d.severity],
            message: { text: d.message },
            locations: [
              {
                physicalLocation: {
                  artifactLocation: { uri: f.path.split('\\').join('/') },
                  region: {
                    startLine: d.range.start.line + 1,
                    startColumn: d.range.start.character + 1,
                    endLine: d.range.end.line + 1,
                    endColumn: d.range.end.character + 1,
                  },
                },
              },
            ],
          })),
        ),
      },
    ],
  };
}
