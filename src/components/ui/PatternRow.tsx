import type { RankedPattern } from '../../../shared/analysis';
import { tileName, type TileKind } from '../../../shared/tiles';
import { Tile } from './Tile';
import { oddsWord } from '../../lib/phase-words';

function TileStrip({ kinds, label }: { kinds: readonly TileKind[]; label: string }) {
  if (kinds.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-0.5" role="img" aria-label={`${label}: ${kinds.map(tileName).join(', ')}`}>
      {kinds.map((kind, i) => (
        <Tile key={`${kind}-${i}`} kind={kind} decorative className="w-[1.5em]" />
      ))}
    </div>
  );
}

/** One pattern of the list against a rack: how far away, what it keeps, what it still needs. */
export function PatternRow({ ranked, odds }: { ranked: RankedPattern; odds?: number }) {
  return (
    <li className="flex flex-col gap-1 border-t border-line/40 py-2 first:border-t-0">
      <p className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="font-semibold">{ranked.pattern.name}</span>
        <span className="flex flex-wrap gap-1">
          <span className="rounded-md bg-paper px-2 text-sm font-semibold">{ranked.away === 0 ? 'complete' : `${ranked.away} away`}</span>
          {odds !== undefined && <span className="rounded-md bg-paper px-2 text-sm font-semibold">{oddsWord(odds)} to finish</span>}
        </span>
      </p>
      <p className="text-sm text-ink-soft">Keeps</p>
      <TileStrip kinds={ranked.keep} label="Keeps" />
      {ranked.need.length > 0 && <p className="text-sm text-ink-soft">Needs {ranked.need.length}</p>}
      <TileStrip kinds={ranked.need} label="Still needs" />
    </li>
  );
}
