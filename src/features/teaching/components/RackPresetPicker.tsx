import { useId, useState } from 'react';
import type { PresetRacks } from '../../../../shared/drills';
import { dealtRackSize, SEATS, type Seat } from '../../../../shared/seats';
import { copiesInSet, DRAGON_KINDS, SUIT_KINDS, tileName, WIND_KINDS, type TileKind } from '../../../../shared/tiles';
import { Tile } from '../../../components/ui/Tile';

const ROWS: { label: string; kinds: readonly TileKind[] }[] = [
  { label: 'Bams', kinds: SUIT_KINDS.filter((k) => k.startsWith('bam')) },
  { label: 'Cracks', kinds: SUIT_KINDS.filter((k) => k.startsWith('crack')) },
  { label: 'Dots', kinds: SUIT_KINDS.filter((k) => k.startsWith('dot')) },
  { label: 'Winds and dragons', kinds: [...WIND_KINDS, ...DRAGON_KINDS] },
  { label: 'Flowers and jokers', kinds: ['flower', 'joker'] },
];

const seatWord = (seat: Seat) => seat[0].toUpperCase() + seat.slice(1);

interface Props {
  racks: PresetRacks;
  jokers: boolean;
  onChange: (racks: PresetRacks) => void;
  /** Server errors: "racks" and "racks.<seat>" (and "racks.<seat>.<n>"). */
  errors: Record<string, string>;
}

/** Builds each seat's preset rack by picking tiles; the engine deals the rest of each rack from what remains. */
export function RackPresetPicker({ racks, jokers, onChange, errors }: Props) {
  const [seat, setSeat] = useState<Seat>('east');
  const id = useId();
  const rack = racks[seat] ?? [];
  const max = dealtRackSize(seat);
  const used = (kind: TileKind) => SEATS.reduce((n, s) => n + (racks[s] ?? []).filter((k) => k === kind).length, 0);
  const left = (kind: TileKind) => copiesInSet(kind, jokers) - used(kind);
  const setRack = (next: TileKind[]) => onChange({ ...racks, [seat]: next });
  const seatError = (s: Seat) => errors[`racks.${s}`] ?? Object.entries(errors).find(([k]) => k.startsWith(`racks.${s}.`))?.[1];
  const error = seatError(seat);

  return (
    <fieldset className="flex flex-col gap-3" aria-describedby={errors.racks ? `${id}-all` : undefined}>
      <legend className="font-semibold">Preset racks</legend>
      <p className="text-base text-ink-soft">Pick tiles a seat starts with. Anything you leave out is dealt from the seed, so a seat may have a few tiles or none.</p>
      {errors.racks && (
        <p id={`${id}-all`} className="font-medium text-danger">
          <span aria-hidden="true">✕ </span>
          {errors.racks}
        </p>
      )}
      <div role="radiogroup" aria-label="Seat to build" className="flex flex-wrap gap-2">
        {SEATS.map((s) => (
          <label
            key={s}
            className={`flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border-2 px-3 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-focus ${s === seat ? 'border-accent bg-accent-soft' : 'border-line bg-card'}`}
          >
            <input type="radio" name={`${id}-seat`} value={s} checked={s === seat} onChange={() => setSeat(s)} className="sr-only" />
            <span className="font-semibold">{seatWord(s)}</span>
            <span className="text-base text-ink-soft">
              {(racks[s] ?? []).length} of {dealtRackSize(s)}
            </span>
            {seatError(s) && <span className="font-semibold text-danger" aria-label="needs a look">✕</span>}
          </label>
        ))}
      </div>

      <div className="flex flex-col gap-2">
        <h3 id={`${id}-rack`} className="font-semibold">
          {seatWord(seat)} starts with {rack.length === 0 ? 'nothing preset' : `${rack.length} of ${max} tiles`}
        </h3>
        {rack.length > 0 ? (
          <ul aria-labelledby={`${id}-rack`} className="flex flex-wrap gap-1">
            {rack.map((kind, i) => (
              <li key={`${kind}-${i}`}>
                <button
                  type="button"
                  onClick={() => setRack(rack.filter((_, k) => k !== i))}
                  aria-label={`Remove ${tileName(kind)} from ${seat}`}
                  className="rounded-md p-0.5 hover:bg-danger-soft"
                >
                  <Tile kind={kind} decorative className="w-11" />
                </button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-base text-ink-soft">Every tile of this rack is dealt from the seed.</p>
        )}
        {error && (
          <p className="font-medium text-danger">
            <span aria-hidden="true">✕ </span>
            {error}
          </p>
        )}
        {rack.length > 0 && (
          <div>
            <button type="button" onClick={() => setRack([])} className="min-h-10 rounded-md px-2 font-medium underline">
              Clear {seat}’s preset
            </button>
          </div>
        )}
      </div>

      <div className="flex flex-col gap-2" role="group" aria-label={`Add tiles to ${seat}`}>
        {ROWS.map((row) => (
          <div key={row.label} className="flex flex-col gap-1">
            <span className="text-base text-ink-soft">{row.label}</span>
            <div className="flex flex-wrap gap-1">
              {row.kinds.map((kind) => {
                const remaining = left(kind);
                const off = kind === 'joker' && !jokers;
                const disabled = rack.length >= max || remaining <= 0 || off;
                return (
                  <button
                    key={kind}
                    type="button"
                    disabled={disabled}
                    onClick={() => setRack([...rack, kind])}
                    aria-label={`Add ${tileName(kind)} to ${seat}${off ? ' (jokers are off)' : `, ${remaining} left`}`}
                    className="rounded-md p-0.5 hover:bg-accent-soft disabled:cursor-not-allowed disabled:opacity-40"
                  >
                    <Tile kind={kind} decorative className="w-9" />
                  </button>
                );
              })}
            </div>
          </div>
        ))}
      </div>
    </fieldset>
  );
}
