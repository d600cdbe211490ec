/**
 * Deterministic synthetic notes for the benchmarks: the running notebook of a fictional coatings lab
 * (Tarnlow Applied Coatings), with prose, code spans, bare formulas, batch blocks, reaction blocks, lists,
 * tables and other fenced code. Same size and seed → same text.
 */
const SALTS = [
  'NaCl',
  'KCl',
  'CaCl2·2H2O',
  'MgSO4·7H2O',
  'CuSO4.5H2O',
  'ZnSO4·7H2O',
  'KH2PO4',
  'Na2HPO4·7H2O',
  'NaHCO3',
  'Na2CO3',
  'K2Cr2O7',
  'KMnO4',
  'NiSO4·6H2O',
  'NiCl2·6H2O',
  'H3BO3',
  'Ca(NO3)2·4H2O',
  'Al2(SO4)3·18H2O',
  'FeCl3·6H2O',
  'Fe3O4',
  '[Co(NH3)6]Cl3',
  'K4[Fe(CN)6]·3H2O',
  'Na2S2O3·5H2O',
  'CH3COONa',
  'C6H8O7',
  'TiO2',
  'ZnO',
  'Fe0.95O',
  'SO₄²⁻',
  'NH4^+',
  'Ca(OH)2',
];
const WRONG = ['CaNO3', 'Al(OH)2', 'NaXx', 'NH4SO4'];
const EQUATIONS = [
  'Zn + H2SO4 -> ZnSO4 + H2',
  '2 NaOH + H2SO4 -> Na2SO4 + 2 H2O',
  'Fe + O2 -> Fe2O3',
  'MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O',
  'CaCO3 -> CaO + CO2',
  'Cu + HNO3 -> Cu(NO3)2 + NO + H2O',
  'Ni^2+ + 2 e^- -> Ni',
];
const WORDS =
  'the rinse was clear after the second pass and the panel showed no bloom so we kept the bath at the same temperature for another hour while I checked OK marks In As CO NO with the operator on line two before lunch'.split(
    ' ',
  );
const UNITS = ['g', 'mg', 'mol', 'mmol', 'M', 'mM'];

/** Small, fast, seedable PRNG (mulberry32). */
export function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function generateNotes(bytes: number, seed = 7): string {
  const r = rng(seed);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(r() * xs.length)];
  const parts: string[] = [];
  let size = 0;
  let section = 0;
  const push = (s: string) => {
    parts.push(s);
    size += s.length + 1;
  };
  while (size < bytes) {
    section++;
    push(`## Trial ${section}: ${pick(['rinse', 'seal', 'strike', 'converter', 'pretreat'])} bath`);
    push('');
    for (let p = 0; p < 3; p++) {
      const words: string[] = [];
      for (let w = 0; w < 40; w++) {
        const x = r();
        if (x < 0.06) words.push(`\`${pick(SALTS)}\``);
        else if (x < 0.09) words.push(pick(SALTS).replace('·', '·'));
        else if (x < 0.095) words.push(`\`${pick(WRONG)}\``);
        else if (x < 0.1) words.push(`\`${pick(EQUATIONS)}\``);
        else words.push(pick(WORDS));
      }
      push(words.join(' ') + '.');
      push('');
    }
    const kind = r();
    if (kind < 0.45) {
      push('```batch');
      push(`name: Bath ${section}-${Math.floor(r() * 90 + 10)}`);
      push(`volume: ${Math.floor(r() * 1900 + 100)} mL`);
      const n = 2 + Math.floor(r() * 4);
      for (let i = 0; i < n; i++)
        push(
          `${pick(SALTS.filter((s) => !s.includes('^') && !s.includes('⁻')))} ${(r() * 20 + 0.1).toFixed(2)} ${pick(UNITS)}${r() < 0.2 ? ' @ 99.5%' : ''}${r() < 0.3 ? '  # from stock' : ''}`,
        );
      push('```');
    } else if (kind < 0.65) {
      push('```reaction');
      push(pick(EQUATIONS));
      push(pick(EQUATIONS));
      push('```');
    } else if (kind < 0.8) {
      push('```python');
      push('for panel in panels:');
      push('    weigh(panel, NaXx=1)  # not a formula: code');
      push('```');
    } else {
      push('| Panel | Bath | Result |');
      push('|---|---|---|');
      push(`| P-${section} | \`${pick(SALTS)}\` | ${pick(['pass', 'bloom', 'pitting'])} |`);
    }
    push('');
    push(`- checked ${pick(SALTS)} stock; ${pick(WORDS)} ${pick(WORDS)}`);
    push(`- next: ${pick(WORDS)} \`${pick(SALTS)}\``);
    push('');
  }
  return parts.join('\n');
}
