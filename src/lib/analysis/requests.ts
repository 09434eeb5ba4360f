/** What the page asks of the rack analysis, and what it answers: plain data, so it crosses to a worker. */
import { adviseRack, completionOdds, rackFocus, type AdviceContext, type AdviceResult, type Pattern, type RackFocus } from '../../../shared/analysis';
import type { TileKind } from '../../../shared/tiles';

export type AnalysisRequest =
  | { kind: 'advice'; hand: TileKind[]; patterns: Pattern[]; context: AdviceContext }
  | { kind: 'focus'; hand: TileKind[]; patterns: Pattern[] }
  /** The odds of finishing the likeliest pattern, for each of many racks (a replay's steps). */
  | { kind: 'odds'; racks: TileKind[][]; patterns: Pattern[] };

export type AnalysisAnswer = { focus: RackFocus | null; advice: AdviceResult['advice']; neighbours: AdviceResult['neighbours']; odds?: { best: number; pattern: string | null }[] };

/** The work itself, the same in a worker and on the page. */
export function answer(request: AnalysisRequest): AnalysisAnswer {
  if (request.kind === 'advice') return adviseRack(request.hand, request.patterns, request.context);
  if (request.kind === 'odds') {
    const names = new Map(request.patterns.map((p) => [p.id, p.name]));
    const odds = request.racks.map((rack) => {
      // The seed is the rack's own, so a rack met at two steps gets the same figure.
      const best = completionOdds(rack, request.patterns, { seed: [...rack].sort().join(',') }).patterns[0];
      return { best: best?.odds ?? 0, pattern: best ? (names.get(best.id) ?? null) : null };
    });
    return { focus: null, advice: [], neighbours: [], odds };
  }
  return { focus: rackFocus(request.hand, request.patterns), advice: [], neighbours: [] };
}
