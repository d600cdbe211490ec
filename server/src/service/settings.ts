/** Settings of the language service; the server maps `ionwright.*` configuration onto these. */
import { DEFAULT_CHEM_SETTINGS, type ChemSettings } from '../chem/settings';
import type { ProseMode } from '../notes/types';

export interface ServiceSettings {
  prose: ProseMode;
  /** Decimal places for molar masses and concentrations in hovers and tables. */
  decimals: number;
  energyUnit: 'kJ/mol' | 'kcal/mol';
  chem: ChemSettings;
}

export const DEFAULT_SETTINGS: ServiceSettings = Object.freeze({
  prose: 'conservative',
  decimals: 2,
  energyUnit: 'kJ/mol',
  chem: DEFAULT_CHEM_SETTINGS,
}) as ServiceSettings;
