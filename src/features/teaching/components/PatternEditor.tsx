import { useId } from 'react';
import { buildsWithoutCalls, patternValue, type Group, type Pattern } from '../../../../shared/analysis/pattern';
import { TILE_KINDS, tileName, type TileKind } from '../../../../shared/tiles';
import { GROUP_NAMES } from '../pattern-example';
import { PatternTiles } from './PatternTiles';
import { TextField } from '../../../components/ui/TextField';

type GroupType = 'tile' | 'suit' | 'dragon';
const SUIT_CHOICES = [
  { value: 'A', label: 'Suit A (any suit)' },
  { value: 'B', label: 'Suit B (another suit)' },
  { value: 'C', label: 'Suit C (the third suit)' },
  { value: 'bam', label: 'Bams' },
  { value: 'crack', label: 'Cracks' },
  { value: 'dot', label: 'Dots' },
];
const VARIABLES = ['n', 'm', 'k'];

const typeOf = (g: Group): GroupType => ('tile' in g ? 'tile' : 'dragon' in g ? 'dragon' : 'suit');

function retype(g: Group, type: GroupType): Group {
  const suit = 'suit' in g ? g.suit : 'A';
  if (type === 'tile') return { size: g.size, tile: 'flower' };
  if (type === 'dragon') return { size: g.size, dragon: 'match', suit };
  return { size: g.size, suit, rank: 1 };
}

const selectClass = (error?: string) => `min-h-12 rounded-lg border-2 bg-card px-2 ${error ? 'border-danger' : 'border-line'}`;

function Select({ label, value, onChange, error, children }: { label: string; value: string; onChange: (v: string) => void; error?: string; children: React.ReactNode }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-base font-medium">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={error ? true : undefined} aria-describedby={error ? `${id}-e` : undefined} className={selectClass(error)}>
        {children}
      </select>
      {error && (
        <p id={`${id}-e`} className="text-base font-medium text-danger">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      )}
    </div>
  );
}

function GroupRow({ group, index, count, onChange, onRemove, errors }: { group: Group; index: number; count: number; onChange: (g: Group) => void; onRemove: () => void; errors: Record<string, string> }) {
  const at = (field: string) => errors[`groups.${index}.${field}`];
  const whole = errors[`groups.${index}`] ?? errors[`groups.${index}.rank.var`] ?? errors[`groups.${index}.rank.offset`];
  const type = typeOf(group);
  const rank = 'rank' in group ? group.rank : 1;
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-line/60 p-3">
      <fieldset className="flex flex-col gap-2">
        <legend className="font-semibold">
          Group {index + 1} of {count}
        </legend>
        <div className="flex flex-wrap items-start gap-3">
          <Select label="Size" value={String(group.size)} onChange={(v) => onChange({ ...group, size: Number(v) })} error={at('size')}>
            {[1, 2, 3, 4, 5, 6].map((n) => (
              <option key={n} value={n}>
                {n} ({GROUP_NAMES[n]})
              </option>
            ))}
          </Select>
          <Select label="Made of" value={type} onChange={(v) => onChange(retype(group, v as GroupType))}>
            <option value="tile">one tile kind</option>
            <option value="suit">a suit and a rank</option>
            <option value="dragon">the suit's matching dragon</option>
          </Select>
          {'tile' in group && (
            <Select label="Tile" value={group.tile} onChange={(v) => onChange({ size: group.size, tile: v as TileKind })} error={at('tile')}>
              {TILE_KINDS.map((k) => (
                <option key={k} value={k}>
                  {tileName(k)}
                </option>
              ))}
            </Select>
          )}
          {'suit' in group && (
            <Select label="Suit" value={group.suit} onChange={(v) => onChange({ ...group, suit: v } as Group)} error={at('suit')}>
              {SUIT_CHOICES.map((s) => (
                <option key={s.value} value={s.value}>
                  {s.label}
                </option>
              ))}
            </Select>
          )}
          {'rank' in group && (
            <>
              <Select
                label="Rank"
                value={typeof rank === 'number' ? String(rank) : rank.var}
                onChange={(v) => onChange({ ...group, rank: /^\d$/.test(v) ? Number(v) : { var: v, offset: typeof rank === 'object' ? rank.offset : 0 } } as Group)}
                error={at('rank')}
              >
                {[1, 2, 3, 4, 5, 6, 7, 8, 9].map((n) => (
                  <option key={n} value={n}>
                    {n}
                  </option>
                ))}
                {VARIABLES.map((v) => (
                  <option key={v} value={v}>
                    any number “{v}”
                  </option>
                ))}
              </Select>
              {typeof rank === 'object' && (
                <Select label={`Offset from ${rank.var}`} value={String(rank.offset)} onChange={(v) => onChange({ ...group, rank: { var: rank.var, offset: Number(v) } } as Group)}>
                  {Array.from({ length: 17 }, (_, i) => i - 8).map((o) => (
                    <option key={o} value={o}>
                      {o === 0 ? `${rank.var} itself` : `${rank.var}${o > 0 ? '+' : ''}${o}`}
                    </option>
                  ))}
                </Select>
              )}
            </>
          )}
        </div>
        {whole && (
          <p className="text-base font-medium text-danger">
            <span aria-hidden="true">✕ </span>
            {whole}
          </p>
        )}
        <div>
          <button type="button" onClick={onRemove} className="min-h-10 rounded-md px-2 font-medium underline" aria-label={`Remove group ${index + 1}`}>
            Remove this group
          </button>
        </div>
      </fieldset>
    </li>
  );
}

interface Props {
  pattern: Pattern;
  onChange: (p: Pattern) => void;
  /** Server errors for this pattern, keyed without the "patterns.<i>." prefix. */
  errors: Record<string, string>;
}

/** One pattern's form, drawn as tiles while it is built. */
export function PatternEditor({ pattern, onChange, errors }: Props) {
  const total = pattern.groups.reduce((n, g) => n + g.size, 0);
  const set = (patch: Partial<Pattern>) => onChange({ ...pattern, ...patch });
  const setGroup = (i: number, g: Group) => set({ groups: pattern.groups.map((x, k) => (k === i ? g : x)) });
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Pattern id" hint="Lower-case letters, digits and dashes, unique in the list." value={pattern.id} onChange={(e) => set({ id: e.target.value })} error={errors.id} />
        <TextField label="Pattern name" value={pattern.name} onChange={(e) => set({ name: e.target.value })} error={errors.name} />
        <TextField label="Family" hint="A word that groups related patterns." value={pattern.family} onChange={(e) => set({ family: e.target.value })} error={errors.family} />
        <TextField
          label="Value"
          hint="What finishing it is worth, 0 to 1000. Rackside's own list runs from 10 to 100: the rarer the hand, the more it is worth."
          type="number"
          inputMode="numeric"
          min={0}
          max={1000}
          value={Number.isFinite(patternValue(pattern)) ? patternValue(pattern) : ''}
          onChange={(e) => set({ value: e.target.value === '' ? Number.NaN : Number(e.target.value) })}
          error={errors.value}
        />
      </div>
      <label className="flex items-start gap-3">
        <input type="checkbox" checked={buildsWithoutCalls(pattern)} onChange={(e) => set({ sealed: e.target.checked })} className="mt-1 h-6 w-6 shrink-0 accent-accent" />
        <span>
          <span className="font-medium">Sealed</span>
          <span className="block text-base text-ink-soft">Build it from your own draws, no calls.</span>
        </span>
      </label>

      <section aria-label="Preview" className="rounded-lg bg-paper p-3">
        <p className="mb-2 font-semibold" aria-live="polite">
          {total} of 14 tiles
          {total !== 14 && <span className="font-normal text-ink-soft"> — {total < 14 ? `add ${14 - total}` : `remove ${total - 14}`}</span>}
        </p>
        <PatternTiles groups={pattern.groups} />
      </section>
      {(errors.groups ?? errors._) && (
        <p className="font-medium text-danger">
          <span aria-hidden="true">✕ </span>
          {errors.groups ?? errors._}
        </p>
      )}

      <ol className="flex flex-col gap-3">
        {pattern.groups.map((g, i) => (
          <GroupRow
            key={i}
            group={g}
            index={i}
            count={pattern.groups.length}
            errors={errors}
            onChange={(next) => setGroup(i, next)}
            onRemove={() => set({ groups: pattern.groups.filter((_, k) => k !== i) })}
          />
        ))}
      </ol>
      <div>
        <button
          type="button"
          onClick={() => set({ groups: [...pattern.groups, { size: 3, suit: 'A', rank: 1 }] })}
          disabled={pattern.groups.length >= 14}
          className="min-h-12 rounded-lg border-2 border-ink-soft bg-card px-4 font-semibold hover:bg-accent-soft"
        >
          Add a group
        </button>
      </div>
    </div>
  );
}
