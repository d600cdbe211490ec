/** `ionwright.*` configuration → service settings, with every value checked (bad values fall back to defaults). */
import type { ChemSettings } from '../chem/settings';
import { DEFAULT_PREVIEW_OPTIONS, type PreviewOptions } from './preview';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';

const num = (v: unknown, lo: number, hi: number, dflt: number) => (typeof v === 'number' && Number.isFinite(v) && v >= lo && v <= hi ? v : dflt);
const oneOf = <T extends string>(v: unknown, allowed: readonly T[], dflt: T): T =>
  typeof v === 'string' && (allowed as readonly string[]).includes(v) ? (v as T) : dflt;

export interface ServerSettings {
  service: ServiceSettings;
  /** Delay before a changed document is validated, ms. */
  validationDelayMs: number;
  /** Whether the computed amounts are shown beside batch lines (`inlayHints.enabled`). */
  inlayHints: boolean;
}

const cache = new Map<string, ServiceSettings>();

/** Settings objects are shared per distinct value, so that caches keyed by settings stay warm. */
function intern(s: ServiceSettings): ServiceSettings {
  const key = JSON.stringify(s);
  const hit = cache.get(key);
  if (hit) return hit;
  cache.set(key, s);
  return s;
}

export function readSettings(raw: unknown): ServerSettings {
  const r = (raw && typeof raw === 'object' ? raw : {}) as Record<string, unknown>;
  const bond = (r.bond && typeof r.bond === 'object' ? r.bond : {}) as Record<string, unknown>;
  const lattice = (r.lattice && typeof r.lattice === 'object' ? r.lattice : {}) as Record<string, unknown>;
  const validation = (r.validation && typeof r.validation === 'object' ? r.validation : {}) as Record<string, unknown>;
  const hints = (r.inlayHints && typeof r.inlayHints === 'object' ? r.inlayHints : {}) as Record<string, unknown>;
  const batch = (r.batch && typeof r.batch === 'object' ? r.batch : {}) as Record<string, unknown>;
  const d = DEFAULT_SETTINGS;
  let nonpolarBelow = num(bond.nonpolarBelow, 0, 4, d.chem.nonpolarBelow);
  let ionicAbove = num(bond.ionicAbove, 0, 4, d.chem.ionicAbove);
  if (nonpolarBelow > ionicAbove) {
    nonpolarBelow = d.chem.nonpolarBelow;
    ionicAbove = d.chem.ionicAbove;
  }
  const chem: ChemSettings = {
    nonpolarBelow,
    ionicAbove,
    latticePreference: oneOf(lattice.method, ['best', 'kapustinskii', 'born-lande', 'born-mayer', 'born-haber'] as const, d.chem.latticePreference),
    phTolerance: num(batch.phTolerance, 0.01, 3, d.chem.phTolerance as number),
    heatThresholdK: num(batch.heatThresholdK, 1, 100, d.chem.heatThresholdK as number),
  };
  const sameChem =
    chem.nonpolarBelow === d.chem.nonpolarBelow &&
    chem.ionicAbove === d.chem.ionicAbove &&
    chem.latticePreference === d.chem.latticePreference &&
    chem.phTolerance === d.chem.phTolerance &&
    chem.heatThresholdK === d.chem.heatThresholdK;
  const service: ServiceSettings = {
    prose: oneOf(r.proseDetection, ['off', 'conservative', 'eager'] as const, d.prose),
    decimals: Math.round(num(r.decimalPlaces, 0, 6, d.decimals)),
    energyUnit: oneOf(r.energyUnit, ['kJ/mol', 'kcal/mol'] as const, d.energyUnit),
    chem: sameChem ? d.chem : chem,
  };
  const same = service.prose === d.prose && service.decimals === d.decimals && service.energyUnit === d.energyUnit && service.chem === d.chem;
  return {
    service: same ? d : intern(service),
    validationDelayMs: Math.round(num(validation.delayMs, 0, 5000, 150)),
    inlayHints: typeof hints.enabled === 'boolean' ? hints.enabled : true,
  };
}

/** `ionwright.*` configuration → the options of the Markdown preview plugin (`preview.typesetFormulas`). */
export function readPreviewOptions(raw: unknown): PreviewOptions {
  const r = (raw && typeof raw === 'object' ? raw : {}) as Record<string, unknown>;
  const preview = (r.preview && typeof r.preview === 'object' ? r.preview : {}) as Record<string, unknown>;
  const typesetFormulas = typeof preview.typesetFormulas === 'boolean' ? preview.typesetFormulas : DEFAULT_PREVIEW_OPTIONS.typesetFormulas;
  return { typesetFormulas, settings: readSettings(raw).service };
}
