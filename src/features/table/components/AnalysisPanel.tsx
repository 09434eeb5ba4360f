import { useMemo, useState } from 'react';
import { BOT_STRATEGIES, starterPatterns, summarizeRack, type AdviceContext, type Pattern, type PassAdvice, type Reason } from '../../../../shared/analysis';
import type { Phase } from '../../../../shared/exchange';
import { tileName, type TileKind } from '../../../../shared/tiles';
import type { AnalysisRequest } from '../../../lib/analysis/requests';
import { useRackAnalysis } from '../../../lib/analysis/use-rack-analysis';
import { PatternRow } from '../../../components/ui/PatternRow';
import { Tile } from '../../../components/ui/Tile';
import { oddsWord } from '../../../lib/phase-words';

interface Props {
  hand: readonly TileKind[];
  /** The pass being chosen now, for advice; null when there is no pass to make. */
  pass: { phase: Phase; blindAllowed: boolean; count: number } | null;
  /** What this seat has seen of the passes so far, for defence (from its view). */
  seen?: Pick<AdviceContext, 'seat' | 'history' | 'kinds'>;
  /** The host hid advice at this table. */
  adviceHidden?: boolean;
  /** The table's pattern list (GET /api/tables/:id/patterns); the starter list until it loads. */
  patterns?: readonly Pattern[];
  /** Picks an advised pass's tiles on the rack. */
  onPick?: (tiles: readonly TileKind[], blind: number) => void;
}

const count = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;


const REASON_STYLE: Record<Reason['kind'], { mark: string; label: string; className: string }> = {
  pro: { mark: '+', label: 'For', className: 'text-ink' },
  con: { mark: '−', label: 'Against', className: 'text-danger' },
  defence: { mark: '!', label: 'Risk', className: 'text-ink' },
};

function Tiles({ kinds, label }: { kinds: readonly TileKind[]; label: string }) {
  return (
    <div role="img" aria-label={`${label}: ${kinds.map(tileName).join(', ')}`} className="flex flex-wrap gap-1">
      {kinds.map((kind, i) => (
        <Tile key={i} kind={kind} decorative className="w-[1.75em]" />
      ))}
    </div>
  );
}

function Advised({ advice, index, onPick }: { advice: PassAdvice; index: number; onPick?: Props['onPick'] }) {
  const label = [...advice.tiles.map(tileName), ...(advice.blind ? [`${advice.blind} blind`] : [])].join(', ');
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-line/50 p-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div className="flex flex-wrap items-center gap-1" role="img" aria-label={`Choice ${index + 1}: pass ${label}`}>
          {advice.tiles.map((kind, j) => (
            <Tile key={j} kind={kind} decorative className="w-[1.75em]" />
          ))}
          {advice.blind > 0 && <span className="ml-1 rounded-md border-2 border-dashed border-ink-soft px-2 text-sm font-semibold">+{advice.blind} blind</span>}
        </div>
        {onPick && (
          <button type="button" className="min-h-10 rounded-md border-2 border-line px-3 text-sm font-semibold" onClick={() => onPick(advice.tiles, advice.blind)}>
            Pick these<span className="sr-only">: {label}</span>
          </button>
        )}
      </div>
      {advice.odds && (
        <p className="text-sm">
          Odds of finishing {advice.toward ? <span className="font-semibold">{advice.toward.name}</span> : 'your best hand'}: {oddsWord(advice.odds.before)} now, {oddsWord(advice.odds.after)} after this pass
        </p>
      )}
      <ul className="flex flex-col gap-1 text-sm">
        {advice.details.map((r, j) => {
          const style = REASON_STYLE[r.kind];
          return (
            <li key={j} className={`flex gap-2 ${style.className}`}>
              <span aria-hidden="true" className="w-4 shrink-0 text-center font-bold">
                {style.mark}
              </span>
              <span>
                <span className="font-semibold">{style.label}:</span> {r.text}
              </span>
            </li>
          );
        })}
      </ul>
    </li>
  );
}

function Glossary() {
  return (
    <details className="text-sm">
      <summary className="cursor-pointer font-semibold">What the words mean</summary>
      <dl className="mt-2 grid grid-cols-1 gap-1">
        <dt className="font-semibold">Away</dt>
        <dd>How many tiles of your rack would have to change to hold the whole hand.</dd>
        <dt className="font-semibold">Keeps and needs</dt>
        <dd>The tiles of your rack a hand uses, and the tiles it still wants.</dd>
        <dt className="font-semibold">Odds</dt>
        <dd>How often, played out many times from here, you would finish the hand before the wall runs out: jokers fill groups of three or more, and hands that allow calls may take a discard.</dd>
        <dt className="font-semibold">Families</dt>
        <dd>Hands alike in what they ask for (the same numbers, runs, winds and dragons). A family is live while you hold enough for it; flexible tiles serve more than one live family, spare tiles serve none.</dd>
        <dt className="font-semibold">Blind</dt>
        <dd>On the last pass of a Charleston you may send on tiles arriving in that pass without looking at them.</dd>
        <dt className="font-semibold">Risk</dt>
        <dd>What the seat your pass goes to seems to collect, from what it has passed you and kept.</dd>
        {BOT_STRATEGIES.map((b) => (
          <div key={b.id} className="contents">
            <dt className="font-semibold">{b.name} (bot)</dt>
            <dd>{b.description}</dd>
          </div>
        ))}
      </dl>
    </details>
  );
}

/** The rack at a glance, where to lean, the odds of the nearest hands and the advised passes, worked out off the page's thread. */
export function AnalysisPanel({ hand, pass, seen, adviceHidden = false, patterns = starterPatterns, onPick }: Props) {
  const [showAdvice, setShowAdvice] = useState(true);
  const handKey = hand.join(',');
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const summary = useMemo(() => summarizeRack(hand, patterns), [handKey, patterns]);
  const wantAdvice = Boolean(pass && pass.count > 0 && showAdvice && !adviceHidden);
  const request: AnalysisRequest | null = hand.length
    ? wantAdvice && pass
      ? { kind: 'advice', hand: [...hand], patterns: [...patterns], context: { phase: pass.phase, blindAllowed: pass.blindAllowed, count: pass.count, ...seen } }
      : { kind: 'focus', hand: [...hand], patterns: [...patterns] }
    : null;
  const key = `${handKey}|${wantAdvice ? `${pass?.phase}:${pass?.blindAllowed}:${pass?.count}:${seen?.history?.length ?? 0}` : 'focus'}|${patterns.map((p) => p.id).join(',')}`;
  const { answer, fresh } = useRackAnalysis(request, key);
  const focus = answer?.focus ?? null;
  const oddsOf = useMemo(() => new Map((focus?.families ?? []).flatMap((f) => f.patterns.map((p) => [p.id, p.odds] as const))), [focus]);
  if (hand.length === 0) return null;
  const suits = `${summary.bySuit.bam} bam, ${summary.bySuit.crack} crack, ${summary.bySuit.dot} dot`;
  const advice = wantAdvice && answer ? answer.advice.slice(0, 3) : [];
  return (
    <section aria-labelledby="analysis-title" aria-busy={!fresh} className="flex flex-col gap-3 rounded-card border border-line/60 bg-card p-4">
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
      </dl>

      <h3 className="font-semibold">Where to lean</h3>
      {focus ? (
        <div className="flex flex-col gap-2">
          <ul className="flex flex-col gap-1">
            {focus.words.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
          {focus.live.length > 0 && (
            <ul aria-label="Live families" className="flex flex-col gap-1 text-sm">
              {focus.live.map((f) => (
                <li key={f.family} className="flex flex-wrap justify-between gap-2">
                  <span>
                    <span className="font-semibold">{f.family}</span> · {f.lean}
                  </span>
                  <span>{oddsWord(f.odds)} to finish</span>
                </li>
              ))}
            </ul>
          )}
          {focus.flexible.length > 0 && <Tiles label="Flexible tiles, serving more than one live family" kinds={focus.flexible.map((f) => f.kind)} />}
          {focus.flexible.length > 0 && <p className="text-sm text-ink-soft">Flexible: these serve more than one live family. Keep them while you choose.</p>}
          {focus.spare.length > 0 && <Tiles label="Spare tiles, serving no live family" kinds={focus.spare} />}
          {focus.spare.length > 0 && <p className="text-sm text-ink-soft">Spare: these serve no live family; they are the first to pass.</p>}
        </div>
      ) : (
        <p role="status" className="text-ink-soft">
          Working out the odds…
        </p>
      )}

      <h3 className="font-semibold">Nearest patterns</h3>
      <ul>
        {summary.nearest.map((ranked) => (
          <PatternRow key={ranked.pattern.id} ranked={ranked} odds={oddsOf.get(ranked.pattern.id)} />
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
          ) : !showAdvice ? (
            <p className="text-ink-soft">Advice is hidden. Choose on your own, then compare.</p>
          ) : advice.length ? (
            <ol className="flex flex-col gap-2">
              {advice.map((a, i) => (
                <Advised key={i} advice={a} index={i} onPick={onPick} />
              ))}
            </ol>
          ) : (
            <p role="status" className="text-ink-soft">
              Weighing every pass…
            </p>
          )}
        </div>
      )}
      <Glossary />
    </section>
  );
}
