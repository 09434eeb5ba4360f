/** What the page asks of the rack analysis, and what it answers: plain data, so it crosses to a worker. */
import { adviseRack, rackFocus, type AdviceContext, type AdviceResult, type Pattern, type RackFocus } from '../../shared/analysis';
import type { TileKind } from '../../shared/tiles';

export type AnalysisRequest =
  | { kind: 'advice'; hand: TileKind[]; patterns: Pattern[]; context: AdviceContext }
  | { kind: 'focus'; hand: TileKind[]; patterns: Pattern[] };

export type AnalysisAnswer = { focus: RackFocus; advice: AdviceResult['advice']; neighbours: AdviceResult['neighbours'] };

/** The work itself, the same in a worker and on the page. */
export function answer(request: AnalysisRequest): AnalysisAnswer {
  if (request.kind === 'advice') return adviseRack(request.hand, request.patterns, request.context);
  return { focus: rackFocus(request.hand, request.patterns), advice: [], neighbours: [] };
}
