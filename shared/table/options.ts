import type { TableOptions } from '../protocol';
import { STARTER_LIST_ID } from '../pattern-lists';

/** A new table's options: whatever was asked for, the rest at Rackside's defaults. */
export function defaultTableOptions(input: Partial<TableOptions> = {}): TableOptions {
  return {
    seed: input.seed ?? null,
    jokers: input.jokers ?? true,
    secondCharleston: input.secondCharleston ?? true,
    courtesy: input.courtesy ?? true,
    huddleEveryPass: input.huddleEveryPass ?? false,
    teaching: input.teaching ?? false,
    hideAdvice: input.hideAdvice ?? false,
    botsPlaySecond: input.botsPlaySecond ?? false,
    patternListId: input.patternListId ?? STARTER_LIST_ID,
  };
}
