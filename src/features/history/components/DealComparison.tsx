import { Link } from 'react-router-dom';
import type { ComparedPassDto, ComparedTableDto, DealComparisonDto } from '../../../../shared/comparisons';
import { SEATS, type Seat } from '../../../../shared/seats';
import { tileName } from '../../../../shared/tiles';
import { Card } from '../../../components/ui/Card';
import { Tile } from '../../../components/ui/Tile';
import { PHASE_TITLES, tilesWord } from '../../../lib/phase-words';

const seatName = (seat: Seat) => seat[0].toUpperCase() + seat.slice(1);

function ordinal(n: number) {
  const tail = n % 100 >= 11 && n % 100 <= 13 ? 'th' : ({ 1: 'st', 2: 'nd', 3: 'rd' } as Record<number, string>)[n % 10] ?? 'th';
  return `${n}${tail}`;
}

function PassLine({ pass }: { pass: ComparedPassDto }) {
  const words = [...pass.sent.map(tileName), ...(pass.blind ? [`${tilesWord(pass.blind)} passed on unseen`] : [])].join(', ');
  return (
    <li className="flex flex-col gap-1">
      <span className="text-sm font-semibold">{PHASE_TITLES[pass.phase]}</span>
      <span role="img" aria-label={words || 'nothing'} className="flex flex-wrap items-center gap-1">
        {pass.sent.map((kind, i) => (
          <Tile key={i} kind={kind} decorative className="w-9" />
        ))}
        {pass.blind > 0 && (
          <span aria-hidden="true" className="rounded-md border-2 border-dashed border-line px-2 py-1 text-sm font-semibold">
            +{pass.blind} blind
          </span>
        )}
      </span>
    </li>
  );
}

/** One seat across every table: the same rack was dealt to it at each, so the columns read side by side. */
function SeatAcross({ seat, tables }: { seat: Seat; tables: ComparedTableDto[] }) {
  return (
    <section aria-label={`${seatName(seat)} at every table`} className="flex flex-col gap-2">
      <h4 className="text-lead font-semibold">{seatName(seat)}</h4>
      <ol className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        {tables.map((t) => {
          const s = t.seats.find((x) => x.seat === seat)!;
          return (
            <li key={t.exchangeId} className="flex flex-col gap-2 rounded-lg border-2 border-line/60 bg-card p-3">
              <p className="font-semibold">
                {t.tableName} · {s.player}
              </p>
              <p>
                {s.awayBefore} away after the deal → <strong>{s.awayAfter} at the end</strong>
                {s.nearest ? ` (nearest: ${s.nearest})` : ''}
              </p>
              <ol className="flex flex-col gap-2" aria-label={`What ${s.player} passed`}>
                {s.passes.map((p, i) => (
                  <PassLine key={i} pass={p} />
                ))}
              </ol>
            </li>
          );
        })}
      </ol>
    </section>
  );
}

/** One deal as every table played it: the tables ranked, every seat nearest first, and each seat's passes side by side. */
export function DealComparison({ deal }: { deal: DealComparisonDto }) {
  const id = `deal-${deal.key}`;
  return (
    <Card>
      <section aria-labelledby={id} className="flex flex-col gap-4">
        <h2 id={id} className="text-lead font-semibold">
          {deal.title}
        </h2>
        <p className="text-ink-soft">
          Judged by the pattern list “{deal.patternListName}”.{deal.seed ? ` Seed: ${deal.seed}.` : ''}
          {deal.stillPlaying > 0 ? ` ${deal.stillPlaying === 1 ? 'One more table is' : `${deal.stillPlaying} more tables are`} still passing and join when finished.` : ''}
        </p>
        {deal.tables.length === 0 ? (
          <p>No table has finished this deal yet.</p>
        ) : deal.tables.length === 1 ? (
          // One table: ranking it, or setting it beside itself, would compare nothing.
          <p>
            Only {deal.tables[0].tableName} has {deal.stillPlaying > 0 ? 'finished' : 'played'} this deal so far: there is no other table to compare it with yet.{' '}
            <Link to={`/replays/${deal.tables[0].exchangeId}`} aria-label={`Replay ${deal.tables[0].tableName}`}>
              Replay it
            </Link>{' '}
            to go over its passes.
          </p>
        ) : (
          <>
            <h3 className="font-semibold">Tables, best first</h3>
            <ol className="flex flex-col gap-1">
              {deal.tables.map((t) => (
                <li key={t.exchangeId}>
                  <strong>{ordinal(t.place)}</strong> {t.tableName}: its nearest seat ended {t.bestAfter} away; the four seats {t.meanAfter} on average.
                </li>
              ))}
            </ol>
            <h3 className="font-semibold">Every seat, nearest first</h3>
            {/* On a phone the same rows as a list, so nothing scrolls sideways; only one of the two is ever shown. */}
            <ol className="flex flex-col gap-2 sm:hidden" aria-label={`Every seat of ${deal.title}, by tiles away at the end`}>
              {deal.standings.map((s) => (
                <li key={`${s.exchangeId}-${s.seat}`} className="border-b border-line/30 pb-2">
                  <strong>{ordinal(s.place)}</strong> {s.player}, {seatName(s.seat)} at {s.tableName}: {s.awayBefore} away after the deal, <strong>{s.awayAfter} at the end</strong>
                  {s.nearest ? ` (${s.nearest})` : ''}
                </li>
              ))}
            </ol>
            <div className="hidden overflow-x-auto sm:block">
              <table className="w-full text-left text-base">
                <caption className="sr-only">Every seat of {deal.title}, by tiles away at the end</caption>
                <thead>
                  <tr className="border-b-2 border-line/60">
                    <th scope="col" className="p-2">Place</th>
                    <th scope="col" className="p-2">Player</th>
                    <th scope="col" className="p-2">Table</th>
                    <th scope="col" className="p-2">Seat</th>
                    <th scope="col" className="p-2">Tiles away at the deal</th>
                    <th scope="col" className="p-2">At the end</th>
                    <th scope="col" className="p-2">Ended nearest</th>
                  </tr>
                </thead>
                <tbody>
                  {deal.standings.map((s) => (
                    <tr key={`${s.exchangeId}-${s.seat}`} className="border-b border-line/30">
                      <td className="p-2">{ordinal(s.place)}</td>
                      <td className="p-2">{s.player}</td>
                      <td className="p-2">{s.tableName}</td>
                      <td className="p-2">{seatName(s.seat)}</td>
                      <td className="p-2">{s.awayBefore}</td>
                      <td className="p-2">{s.awayAfter}</td>
                      <td className="p-2">{s.nearest ?? '—'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <h3 className="font-semibold">Seat by seat: what each passed at each step</h3>
            {SEATS.map((seat) => (
              <SeatAcross key={seat} seat={seat} tables={deal.tables} />
            ))}
          </>
        )}
      </section>
    </Card>
  );
}
