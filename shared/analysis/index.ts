/** Judging a rack: the pattern format, tiles away, pass advice, rack summaries and the starter list. */
export {
  HAND_SIZE,
  JOKER_MIN_GROUP,
  MAX_GROUP_SIZE,
  MIN_GROUP_SIZE,
  SUIT_LETTERS,
  groupLabel,
  type Group,
  type Pattern,
  type RankRef,
  type SuitLetter,
  type SuitRef,
} from './pattern';
export { patternSchema, validatePattern, validatePatternList } from './schema';
export { enumerateAssignments, groupKind, type Assignment } from './compile';
export { bestAway, fitDetail, rankPatterns, tilesAway, tilesAwayCounts, countsOf, type FitDetail, type RankedPattern } from './away';
export {
  ADVICE,
  adviceContextFor,
  advisePass,
  adviseRack,
  passChoices,
  type AdviceContext,
  type AdviceResult,
  type PassAdvice,
  type Reason,
  type ReasonKind,
} from './advice';
export { DEFENCE } from './defence';
export { rackFocus, LIVE, PICK, type FamilyFocus, type FocusOptions, type RackFocus } from './focus';
export { neighbourWords, passRisk, readNeighbours, riskSentence, RISK_LEVELS, type DefenceInput, type NeighbourRead, type PassRisk, type RiskLevel, type Trait } from './defence';
export { summarizeRack, type RackSummary } from './summary';
export { STARTER_FAMILIES, starterPatterns } from './starter-patterns';
export * from './bots';
export { COST_UNIT, DEFAULT_CALL_RATE, missingPrice, rankByPrice, type MissingPrice, type MissingTile, type PricedPattern } from './price';
export { completionOdds, ODDS_DEFAULTS, type CompletionOdds, type OddsOptions } from './odds';
