/** Drills: saved deals a teacher runs again and again. The wire schema, its checks and the DTOs. */
import { z } from 'zod';
import { validateOptions } from './exchange/options';
import type { ExchangeOptions } from './exchange/types';
import { SEATS, type Seat } from './seats';
import { TILE_KINDS, type TileKind } from './tiles';
import { TABLE_LIMITS } from './protocol';
import { STARTER_LIST_ID } from './pattern-lists';

export const DRILL_LIMITS = { nameMax: 80, descriptionMax: 2000, seedMax: TABLE_LIMITS.seedMax } as const;

export type PresetRacks = Partial<Record<Seat, TileKind[]>>;

const kind = z.enum(TILE_KINDS as [TileKind, ...TileKind[]], { error: 'That is not a tile kind.' });
// The engine checks the real limits (13 or 14 per seat, copies in the set); this only bounds the input.
const rack = z.array(kind, { error: 'A preset rack is a list of tiles.' }).max(20, 'A preset rack holds at most 14 tiles.');

export const drillInputSchema = z
  .object({
    name: z
      .string({ error: 'Give the drill a name.' })
      .trim()
      .min(1, 'Give the drill a name.')
      .max(DRILL_LIMITS.nameMax, `A drill name has at most ${DRILL_LIMITS.nameMax} characters.`),
    description: z
      .string({ error: 'A description is text.' })
      .trim()
      .max(DRILL_LIMITS.descriptionMax, `A description has at most ${DRILL_LIMITS.descriptionMax} characters.`)
      .default(''),
    seed: z
      .string({ error: 'Give the deal a seed: any word or phrase, such as harbor-lane-week-01.' })
      .trim()
      .min(1, 'Give the deal a seed: any word or phrase, such as harbor-lane-week-01.')
      .max(DRILL_LIMITS.seedMax, `A seed has at most ${DRILL_LIMITS.seedMax} characters.`),
    jokers: z.boolean({ error: 'Jokers are on (true) or off (false).' }).default(true),
    secondCharleston: z.boolean({ error: 'The second Charleston is on (true) or off (false).' }).default(true),
    courtesy: z.boolean({ error: 'The courtesy pass is on (true) or off (false).' }).default(true),
    racks: z
      .object({ east: rack.optional(), south: rack.optional(), west: rack.optional(), north: rack.optional() }, { error: 'Preset racks name seats: east, south, west, north.' })
      .strict()
      .default({}),
    patternListId: z.string({ error: 'Pick a pattern list.' }).trim().min(1, 'Pick a pattern list.').max(64).default(STARTER_LIST_ID),
  })
  .strict();
export type DrillInput = z.input<typeof drillInputSchema>;
export type DrillData = z.output<typeof drillInputSchema>;

/** Only the seats that hold tiles, in seat order. */
export function presetRacksOf(racks: PresetRacks): PresetRacks {
  const out: PresetRacks = {};
  for (const seat of SEATS) if (racks[seat]?.length) out[seat] = racks[seat]!.slice();
  return out;
}

/** The engine options a drill deals with. */
export function drillExchangeOptions(drill: Pick<DrillData, 'seed' | 'jokers' | 'secondCharleston' | 'courtesy' | 'racks'>): ExchangeOptions {
  const racks = presetRacksOf(drill.racks);
  return {
    seed: drill.seed,
    jokers: drill.jokers,
    secondCharleston: drill.secondCharleston,
    courtesy: drill.courtesy,
    ...(Object.keys(racks).length ? { racks } : {}),
  };
}

/**
 * What the engine says is impossible about a drill's deal, as field errors: a seat's own
 * problem (too many tiles, a joker in a joker-free deal) under `racks.<seat>`, and a problem
 * of the racks together (a fifth 3 bam) under `racks`.
 */
export function drillDealErrors(drill: Pick<DrillData, 'seed' | 'jokers' | 'secondCharleston' | 'courtesy' | 'racks'>): Record<string, string> {
  const fields: Record<string, string> = {};
  const options = drillExchangeOptions(drill);
  for (const seat of SEATS) {
    const own = options.racks?.[seat];
    if (!own) continue;
    const problem = validateOptions({ ...options, racks: { [seat]: own } });
    if (problem) fields[`racks.${seat}`] = problem;
  }
  if (Object.keys(fields).length === 0) {
    const problem = validateOptions(options);
    if (problem) fields.racks = problem;
  }
  return fields;
}

export interface DrillDto {
  id: string;
  name: string;
  description: string;
  seed: string;
  jokers: boolean;
  secondCharleston: boolean;
  courtesy: boolean;
  racks: PresetRacks;
  patternListId: string;
  patternListName: string;
  updatedAt: string;
}
