import { useMemo, useState } from 'react';
import { advisePass, starterPatterns, summarizeRack, type Pattern } from '../../shared/analysis';
import type { Phase } from '../../shared/exchange';
import { tileName, type TileKind } from '../../shared/tiles';
import { PatternRow } from './PatternRow';
import { Tile } from './Tile';

interface Props {
  hand: readonly TileKind[];
  /** The pass being chosen now, for advice; null when there is no pass to make. */
  pass: { phase: Phase; blindAllowed: boolean; count: number } | null;
  /** The host hid advice at this table. */
  adviceHidden?: boolean;
  /** The table's pattern list (GET /api/tables/:id/patterns); the starter list until it loads. */
  patterns?: readonly Pattern[];
}

const count = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** The rack at a glance, the nearest patterns and the advised passes, all worked out in the browser. */
export function AnalysisPanel({ hand, pass, adviceHidden = false, patterns = starterPatterns }: Props) {
  const [showAdvice, setShowAdvice] = useState(true);
  const key = hand.join(',');
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const summary = useMemo(() => summarizeRack(hand, patterns), [key, patterns]);
  const advice = useMemo(
    () => (pass && pass.count > 0 && showAdvice && !adviceHidden ? advisePass(hand, patterns, pass).slice(0, 3) : []),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [key, pass?.phase, pass?.blindAllowed, pass?.count, showAdvice, adviceHidden, patterns],
  );
  if (hand.length === 0) return null;
  const suits = `${summary.bySuit.bam} bam, ${summary.bySuit.crack} crack, ${summary.bySuit.dot} dot`;
  return (
    <section aria-labelledby="analysis-title" className="flex flex-col gap-3 rounded-card border border-line/60 bg-card p-4">
      <h2 id="analysis-title" className="text-lead font-semibold">
        Your rack at a glance
      </h2>
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-base">
        <dt className="text-ink-soft">Suits</dt>
        <dd>{suits}</dd>
        <dt className="text-ink-soft">Others</dt>
        <dd>
          {count(summary.winds, 'wind')}, {count(summary.dragons, 'dragon')}, {count(summary.flowers, 'flower')}, {count(summary.jokers, 'joker')}
        </dd>
        <dt className="text-ink-soft">Pairs</dt>
        <dd>{summary.pairs.length ? summary.pairs.map(tileName).join(', ') : 'none'}</dd>
        <dt className="text-ink-soft">Pungs</dt>
        <dd>{summary.pungs.length ? summary.pungs.map(tileName).join(', ') : 'none'}</dd>
        <dt className="text-ink-soft">Leading suit</dt>
        <dd>{summary.leadingSuit ?? 'none'}</dd>
      </dl>
      <h3 className="font-semibold">Nearest patterns</h3>
      <ul>
        {summary.nearest.map((ranked) => (
          <PatternRow key={ranked.pattern.id} ranked={ranked} />
        ))}
      </ul>
      {pass && pass.count > 0 && (
        <div className="flex flex-col gap-2">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h3 className="font-semibold">Advised passes</h3>
            {!adviceHidden && (
              <button type="button" className="min-h-10 rounded-md border-2 border-line px-3 text-sm font-semibold" aria-pressed={!showAdvice} onClick={() => setShowAdvice((v) => !v)}>
                {showAdvice ? 'Hide advice' : 'Show advice'}
              </button>
            )}
          </div>
          {adviceHidden ? (
            <p className="text-ink-soft">The host has hidden advice at this table: this pass is yours alone.</p>
          ) : showAdvice ? (
            <ol className="flex flex-col gap-2">
              {advice.map((a, i) => (
                <li key={i} className="rounded-lg border border-line/50 p-2">
                  <div className="flex flex-wrap items-center gap-1" role="img" aria-label={`Pass ${[...a.tiles.map(tileName), ...(a.blind ? [`${a.blind} blind`] : [])].join(', ')}`}>
                    {a.tiles.map((kind, j) => (
                      <Tile key={j} kind={kind} decorative className="w-7" />
                    ))}
                    {a.blind > 0 && <span className="ml-1 rounded-md border-2 border-dashed border-ink-soft px-2 text-sm font-semibold">+{a.blind} blind</span>}
                  </div>
                  <ul className="mt-1 list-disc pl-5 text-sm">
                    {a.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                </li>
              ))}
            </ol>
          ) : (
            <p className="text-ink-soft">Advice is hidden. Choose on your own, then compare.</p>
          )}
        </div>
      )}
    </section>
  );
}
