import { Link, useParams } from 'react-router-dom';
import type { ProgressDto, ProgressPointDto } from '../../../../shared/progress';
import { useMe } from '../../../lib/api/auth';
import { useProgress } from '../api/progress';
import { ProgressChart, type LineStyle } from '../components/ProgressChart';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { countWord } from '../../../lib/phase-words';
import { SignInFirst } from '../../../components/ui/SignInFirst';

const percent = (n: number | null) => (n === null ? '—' : `${Math.round(n * 100)}%`);
const share = (n: number, of: number) => (of ? Math.round((n / of) * 100) : 0);
const dateOf = (iso: string) => new Date(iso).toLocaleDateString();

const AWAY_LINES: LineStyle[] = [
  { key: 'before', name: 'Tiles away after the deal', stroke: '#7a3b00', dash: '8 4', dot: 'square' },
  { key: 'after', name: 'Tiles away at the end', stroke: '#0a6560', dot: 'circle' },
];
const HABIT_LINES: LineStyle[] = [
  { key: 'advised', name: 'Passes as advised', stroke: '#0a6560', dot: 'circle' },
  { key: 'pair', name: 'Passes that broke a pair the advice kept', stroke: '#7a3b00', dash: '8 4', dot: 'square' },
  { key: 'flower', name: 'Passes with a flower', stroke: '#4a3a9e', dash: '2 4', dot: 'diamond' },
];

function Totals({ progress }: { progress: ProgressDto }) {
  const t = progress.totals;
  const items: [string, string][] = [
    ['Exchanges played', String(t.exchanges)],
    ['Tiles away gained on average', t.meanGained === null ? '—' : (Math.round(t.meanGained * 10) / 10).toString()],
    ['Passes as advised', percent(t.asAdvisedRate)],
    ['Passes that broke a pair the advice kept', percent(t.brokePairRate)],
    ['Passes with a flower', percent(t.passedFlowerRate)],
  ];
  return (
    <dl className="grid grid-cols-1 gap-3 sm:grid-cols-3 lg:grid-cols-5">
      {items.map(([term, value]) => (
        <div key={term} className="rounded-lg border-2 border-line/60 bg-card p-3">
          <dt className="text-sm text-ink-soft">{term}</dt>
          <dd className="text-title font-semibold">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function PointsTable({ points, name }: { points: ProgressPointDto[]; name: string }) {
  return (
    <>
      {/* On a phone the same rows as a list, so nothing scrolls sideways; only one of the two is ever shown. */}
      <ol className="flex flex-col gap-2 sm:hidden" aria-label={`Every exchange of ${name}, oldest first`}>
        {points.map((p, i) => (
          <li key={p.exchangeId} className="rounded-lg border-2 border-line/60 bg-card p-3">
            <p className="font-semibold">
              {i + 1}. {dateOf(p.finishedAt)} · {p.tableName} · <span className="capitalize">{p.seat}</span>
            </p>
            <p>
              {p.awayBefore} away after the deal, {p.awayAfter} at the end ({p.gained > 0 ? `+${p.gained}` : p.gained})
            </p>
            <p>
              Of {countWord(p.passes, 'pass', 'passes')}: {p.asAdvised} as advised, {p.brokePair} broke a pair the advice kept, {p.passedFlower} with a flower
            </p>
          </li>
        ))}
      </ol>
      <div className="hidden overflow-x-auto rounded-card border border-line/60 bg-card sm:block">
        <table className="w-full text-left text-base">
          <caption className="sr-only">Every exchange of {name}, oldest first</caption>
          <thead>
            <tr className="border-b-2 border-line/60">
              <th scope="col" className="p-2">#</th>
              <th scope="col" className="p-2">Date</th>
              <th scope="col" className="p-2">Table</th>
              <th scope="col" className="p-2">Seat</th>
              <th scope="col" className="p-2">Tiles away after the deal</th>
              <th scope="col" className="p-2">At the end</th>
              <th scope="col" className="p-2">Gained</th>
              <th scope="col" className="p-2">Passes as advised</th>
              <th scope="col" className="p-2">Broke a pair</th>
              <th scope="col" className="p-2">With a flower</th>
            </tr>
          </thead>
          <tbody>
            {points.map((p, i) => (
              <tr key={p.exchangeId} className="border-b border-line/30">
                <td className="p-2">{i + 1}</td>
                <td className="p-2">{dateOf(p.finishedAt)}</td>
                <td className="p-2">{p.tableName}</td>
                <td className="p-2 capitalize">{p.seat}</td>
                <td className="p-2">{p.awayBefore}</td>
                <td className="p-2">{p.awayAfter}</td>
                <td className="p-2">{p.gained > 0 ? `+${p.gained}` : p.gained}</td>
                <td className="p-2">
                  {p.asAdvised} of {p.passes}
                </td>
                <td className="p-2">
                  {p.brokePair} of {p.passes}
                </td>
                <td className="p-2">
                  {p.passedFlower} of {p.passes}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}

export function ProgressPage() {
  const { userId } = useParams();
  const { data: me, isPending: mePending } = useMe();
  const who = userId ? Number(userId) : 'me';
  const progress = useProgress(who);
  if (mePending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (progress.error) {
    return (
      <Card className="mx-auto max-w-lg">
        <h1 className="mb-3 text-title font-semibold">This progress is not open to you</h1>
        <FormMessage error>{progress.error.message}</FormMessage>
        <p className="mt-3">
          <Link to="/progress">See your own progress</Link>
        </p>
      </Card>
    );
  }
  if (!progress.data) return <p role="status">Working out the figures…</p>;
  const p = progress.data;
  const mine = p.user.id === me.id;
  const title = mine ? 'My progress' : `Progress of ${p.user.displayName}`;
  const label = (x: ProgressPointDto, i: number) => `${i + 1}. ${dateOf(x.finishedAt)}`;
  const away = p.points.map((x, i) => ({ label: label(x, i), before: x.awayBefore, after: x.awayAfter }));
  const habits = p.points.map((x, i) => ({ label: label(x, i), advised: share(x.asAdvised, x.passes), pair: share(x.brokePair, x.passes), flower: share(x.passedFlower, x.passes) }));

  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-title font-semibold">{title}</h1>
      {p.points.length === 0 ? (
        <p>
          No finished exchanges yet. {mine ? <Link to="/">Sit at a table</Link> : null}
          {mine ? ' and play one to see your figures here.' : ''}
        </p>
      ) : (
        <>
          <Totals progress={p} />
          <p className="text-ink-soft">
            Tiles away are counted from the nearest pattern of each table&apos;s own list. A pass counts as advised when it sent the same tiles as the top advice
            for the rack at that step (or advice scored just as high). {p.truncated ? `Only the ${p.points.length} most recent exchanges are counted.` : ''}
          </p>
          <Card>
            <figure className="flex flex-col gap-2">
              <figcaption className="font-semibold">Tiles away from the nearest pattern, after the deal and at the end of each exchange</figcaption>
              <ProgressChart data={away} lines={AWAY_LINES} domain={[0, 'dataMax + 1']} />
            </figure>
          </Card>
          <Card>
            <figure className="flex flex-col gap-2">
              <figcaption className="font-semibold">Share of passes in each exchange: as advised, breaking a pair, with a flower</figcaption>
              <ProgressChart data={habits} lines={HABIT_LINES} unit="%" domain={[0, 100]} />
            </figure>
          </Card>
          <section aria-labelledby="points-title" className="flex flex-col gap-2">
            <h2 id="points-title" className="text-lead font-semibold">
              Every exchange, oldest first
            </h2>
            <PointsTable points={p.points} name={mine ? 'you' : p.user.displayName} />
          </section>
        </>
      )}
    </div>
  );
}
