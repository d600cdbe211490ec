/**
 * Warm the engine while the editor is still starting: analyse a small sample of notes a few times so that
 * the scanner and the chemistry are compiled before the first real document arrives (a cold first
 * analysis of a large notebook is several times slower than a warm one). Takes a few tens of ms.
 */
import { analyseDocument } from '../service/document';
import { documentDiagnostics } from '../service/diagnostics';
import { formulaCardMarkdown } from '../service/hover';
import { DEFAULT_SETTINGS, type ServiceSettings } from '../service/settings';

const SAMPLE = [
  '# Warm-up sample',
  '',
  'Weighed `NaCl`, `CuSO4.5H2O`, `K4[Fe(CN)6]·3H2O` and `CaNO3`; also MgSO4·7H2O and Fe3+ in prose, `NaXx`.',
  '',
  '```batch',
  'name: Sample',
  'volume: 500 mL',
  'KH2PO4 3.4 g @ 99.5%',
  'NaCl 0.1 M  # comment',
  '```',
  '',
  '```reaction',
  'MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O',
  'Fe + O2 -> Fe2O3',
  '```',
  '',
  '| a | `Al(OH)3` |',
  '',
].join('\n');

export function warmUp(settings: ServiceSettings = DEFAULT_SETTINGS) {
  for (let i = 0; i < 40; i++) {
    // Vary the text so that every block is analysed afresh, not read from the block cache.
    const doc = analyseDocument(SAMPLE.replace('Warm-up sample', `Warm-up sample ${i}`).replace('NaCl 0.1 M', `NaCl 0.${i + 1} M`) + '\n' + `Note ${i}: \`Na${i % 3 ? 'Cl' : 'Br'}\` and CaCl${(i % 3) + 1}.`, i % 5 ? 'markdown' : 'fnote', settings);
    documentDiagnostics(doc);
    if (i % 10 === 0) for (const f of doc.formulas.slice(0, 4)) formulaCardMarkdown(f.analysis, settings);
  }
}
