import { useEffect, useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { rankPatterns, type Pattern } from '../../../../shared/analysis';
import type { ExchangeReplayDto } from '../../../../shared/protocol';
import { SEATS, seatTo, type Seat } from '../../../../shared/seats';
import { tileName, type Tile as TileData } from '../../../../shared/tiles';
import { useMe } from '../../../lib/api/auth';
import { ApiError } from '../../../lib/api/client';
import { useReplay } from '../api/replay';
import { AwayChart } from '../components/AwayChart';
import { Button } from '../../../components/ui/Button';
import { MoveDiagram } from '../components/MoveDiagram';
import { PatternRow } from '../../../components/ui/PatternRow';
import { Rack } from '../../../components/ui/Rack';
import { nearestOf, PASS_DIRECTION, replaySteps, type ReplayStep } from '../replay-steps';
import { Tile } from '../../../components/ui/Tile';
import { useRackAnalysis } from '../../../lib/analysis/use-rack-analysis';
import { capitalise } from '../../../lib/seating';
import { SignInFirst } from '../../../components/ui/SignInFirst';
import { oddsWord } from '../../../lib/phase-words';

/** The three nearest patterns, worked out only when opened. */
function RackDetail({ rack, patterns }: { rack: readonly TileData[]; patterns: readonly Pattern[] }) {
  const [open, setOpen] = useState(false);
  return (
    <details onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="cursor-pointer text-base font-medium">What this rack keeps and needs</summary>
      {open && (
        <ul>
          {rankPatterns(rack.map((t) => t.kind), patterns, 3).map((ranked) => (
            <PatternRow key={ranked.pattern.id} ranked={ranked} />
          ))}
        </ul>
      )}
    </details>
  );
}

function SeatPanel({ step, seat, name, patterns, odds }: { step: ReplayStep; seat: Seat; name: string; patterns: readonly Pattern[]; odds: { best: number; pattern: string | null } | null }) {
  const rack = step.state.racks[seat];
  const pass = step.pass;
  const kinds = new Map(SEATS.flatMap((s) => step.state.racks[s].map((t) => [t.id, t.kind] as const)));
  const sent = pass ? pass.sent[seat] : [];
  const direction = pass ? PASS_DIRECTION[pass.phase] : undefined;
  const nearest = nearestOf(step.state, seat, patterns);
  return (
    <section aria-label={`${capitalise(seat)}: ${name}`} className="flex min-w-0 flex-col gap-2 rounded-card border border-line/60 bg-card p-3">
      <h3 className="font-semibold">
        {name} <span className="text-ink-soft">· {seat}</span>
      </h3>
      <Rack label={`Rack of ${name}`} tiles={rack} received={pass ? pass.received[seat] : []} size="small" />
      {pass && direction && (sent.length > 0 || pass.blind[seat] > 0) && (
        <div className="flex flex-wrap items-center gap-1 text-base" role="img" aria-label={`Sent to ${seatTo(seat, direction)}: ${sent.map((id) => tileName(kinds.get(id)!)).join(', ')}${pass.blind[seat] ? `, and ${pass.blind[seat]} blind` : ''}`}>
          <span className="font-medium">Sent to {seatTo(seat, direction)}:</span>
          {sent.map((id) => (
            <Tile key={id} kind={kinds.get(id)!} decorative className="w-7" />
          ))}
          {pass.blind[seat] > 0 && <span className="rounded-md border-2 border-dashed border-ink-soft px-1.5 text-sm font-semibold">+{pass.blind[seat]} blind</span>}
        </div>
      )}
      {nearest && (
        <p className="text-base">
          Nearest: <span className="font-semibold">{nearest.pattern.name}</span>, {nearest.away} away
        </p>
      )}
      {odds && (
        <p className="text-base">
          Odds of finishing{odds.pattern ? <> {odds.pattern}</> : null}: <span className="font-semibold">{oddsWord(odds.best)}</span>
        </p>
      )}
      <RackDetail rack={rack} patterns={patterns} />
    </section>
  );
}

function useStepKeys(count: number, setIndex: (fn: (i: number) => number) => void) {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      if (target && /^(INPUT|TEXTAREA|SELECT)$/.test(target.tagName)) return;
      if (target?.closest('[role="group"][aria-label^="Rack"]')) return;
      const moves: Record<string, (i: number) => number> = {
        ArrowRight: (i) => Math.min(count - 1, i + 1),
        ArrowLeft: (i) => Math.max(0, i - 1),
        Home: () => 0,
        End: () => count - 1,
      };
      const move = moves[e.key];
      if (!move) return;
      e.preventDefault();
      setIndex(move);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [count, setIndex]);
}

function Replay({ dto }: { dto: ExchangeReplayDto }) {
  const steps = useMemo(() => replaySteps(dto), [dto]);
  const [params, setParams] = useSearchParams();
  const fromUrl = Number(params.get('step') ?? 0);
  const [index, setIndexState] = useState(Number.isInteger(fromUrl) ? Math.max(0, Math.min(steps.length - 1, fromUrl)) : 0);
  const [copied, setCopied] = useState(false);
  const setIndex = useMemo(
    () => (fn: (i: number) => number) =>
      setIndexState((i) => {
        const next = fn(i);
        setParams(next === 0 ? {} : { step: String(next) }, { replace: true });
        return next;
      }),
    [setParams],
  );
  useStepKeys(steps.length, setIndex);
  const step = steps[index];
  // The odds of finishing, for every seat at every step, worked out off the page's thread.
  const racks = useMemo(() => steps.flatMap((st) => SEATS.map((s) => st.state.racks[s].map((t) => t.kind))), [steps]);
  const { answer: oddsAnswer } = useRackAnalysis({ kind: 'odds', racks, patterns: dto.patternList.patterns }, `replay:${dto.id}`);
  const oddsAt = (i: number, seat: Seat) => oddsAnswer?.odds?.[i * SEATS.length + SEATS.indexOf(seat)] ?? null;
  const names = Object.fromEntries(SEATS.map((s) => [s, dto.seats[s].displayName])) as Record<Seat, string>;
  const passNumber = step.state.history.length - 1;
  const notes = step.pass ? dto.notes.filter((n) => n.passIndex === passNumber) : [];
  const share = `${window.location.origin}/replays/${dto.id}${index ? `?step=${index}` : ''}`;

  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-col gap-1">
        <h1 className="text-title font-semibold">Replay: {dto.tableName}</h1>
        <p className="text-ink-soft">{new Date(dto.startedAt).toLocaleString()}</p>
      </header>
      <div className="flex flex-col gap-3 rounded-card border border-line/60 bg-card p-3 sm:p-4">
        <p aria-live="polite" className="text-lead font-semibold">
          Step {index} of {steps.length - 1}: {step.title}
        </p>
        <div role="group" aria-label="Step through the exchange" className="flex flex-wrap gap-2">
          <Button onClick={() => setIndex(() => 0)} disabled={index === 0}>
            Back to the deal
          </Button>
          <Button onClick={() => setIndex((i) => Math.max(0, i - 1))} disabled={index === 0}>
            ← Previous step
          </Button>
          <Button kind="primary" onClick={() => setIndex((i) => Math.min(steps.length - 1, i + 1))} disabled={index === steps.length - 1}>
            Next step →
          </Button>
          <Button onClick={() => setIndex(() => steps.length - 1)} disabled={index === steps.length - 1}>
            To the end
          </Button>
        </div>
        <p className="text-sm text-ink-soft">The left and right arrow keys step too; Home and End jump.</p>
      </div>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <section aria-labelledby="racks-title" className="flex min-w-0 flex-col gap-2">
          <h2 id="racks-title" className="text-lead font-semibold">
            Every rack at this step
          </h2>
          <div className="grid min-w-0 grid-cols-1 gap-3 md:grid-cols-2">
            {SEATS.map((s) => (
              <SeatPanel key={s} step={step} seat={s} name={names[s]} patterns={dto.patternList.patterns} odds={oddsAt(index, s)} />
            ))}
          </div>
        </section>
        <aside className="flex min-w-0 flex-col gap-4" aria-label="This step">
          {step.pass ? <MoveDiagram pass={step.pass} names={names} /> : <p className="text-ink-soft">No tiles moved in this step.</p>}
          <section aria-labelledby="notes-title" className="rounded-card border border-line/60 bg-card p-3">
            <h2 id="notes-title" className="font-semibold">
              Huddle notes for this pass
            </h2>
            {notes.length === 0 ? (
              <p className="text-ink-soft">None.</p>
            ) : (
              <ul className="flex flex-col gap-1">
                {notes.map((n) => (
                  <li key={n.id}>
                    <span className="font-semibold">{n.authorName}</span>
                    {n.seat && <span className="text-ink-soft"> on {n.seat}</span>}: {n.text}
                  </li>
                ))}
              </ul>
            )}
          </section>
        </aside>
      </div>
      <AwayChart steps={steps} names={names} current={index} />
      <section aria-labelledby="odds-title" className="flex min-w-0 flex-col gap-2 rounded-card border border-line/60 bg-card p-3 sm:p-4">
        <h2 id="odds-title" className="text-lead font-semibold">
          Odds of finishing, step by step
        </h2>
        <p className="text-sm text-ink-soft">How often each rack, played out from that step, finishes its likeliest pattern of the table&apos;s list before the wall runs out.</p>
        {oddsAnswer?.odds ? (
          <div className="overflow-x-auto" role="region" aria-label="Odds by step" tabIndex={0}>
            <table className="text-sm">
              <thead>
                <tr>
                  <th scope="col" className="p-1 text-left">
                    Step
                  </th>
                  {SEATS.map((s) => (
                    <th key={s} scope="col" className="p-1 text-right">
                      {names[s]}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {steps.map((st, i) => (
                  <tr key={i} className={i === index ? 'font-semibold' : undefined}>
                    <th scope="row" className="p-1 text-left font-normal">
                      {st.short}
                    </th>
                    {SEATS.map((s) => (
                      <td key={s} className="p-1 text-right">
                        {oddsWord(oddsAt(i, s)?.best ?? 0)}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : (
          <p role="status" className="text-ink-soft">
            Working out the odds…
          </p>
        )}
      </section>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          onClick={() => {
            void navigator.clipboard?.writeText(share).then(() => setCopied(true));
          }}
        >
          Copy the link to this replay
        </Button>
        <span className="break-all text-base">{share}</span>
        <span role="status">{copied ? 'Link copied.' : ''}</span>
      </div>
    </div>
  );
}

export function ReplayPage() {
  const { id = '' } = useParams();
  const { data: me, isPending: mePending } = useMe();
  const replay = useReplay(id);
  if (mePending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (replay.isPending) return <p role="status">Loading the replay…</p>;
  if (replay.error)
    return (
      <div role="alert" className="flex flex-col gap-2">
        <p>{replay.error instanceof ApiError ? replay.error.message : 'The replay could not be loaded.'}</p>
        <Link to="/history">Back to my exchanges</Link>
      </div>
    );
  return <Replay dto={replay.data} />;
}
