/** Chemical equations: parsing, exact balancing, and the reaction analysis used by the service. */
export { ARROWS, findArrow, isReversible, type Arrow, type ArrowMatch } from './arrows';
export * as rationalMath from './rational';
export type { Rational } from './rational';
export { allSpecies, parseEquation, type ParsedEquation, type Species } from './parse';
export {
  analyseReaction,
  balanceCheck,
  balanceEquation,
  clearReactionCache,
  displayEquation,
  formatSignedCharge,
  MAX_ELEMENTS,
  MAX_SPECIES,
  nullSpace,
  smallestIntegers,
  unbalancedMessage,
  writeEquation,
  type BalanceCheck,
  type BalanceResult,
  type BalanceStatus,
  type ReactionAnalysis,
} from './balance';
