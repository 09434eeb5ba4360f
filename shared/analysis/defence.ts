/**
 * Defence that remembers: what each neighbour passed this seat and what this seat passed each
 * of them, read from the seat's own view of the exchange, and the risk of feeding the seat a
 * pass goes to now.
 *
 * A seat sees, of every resolved pass, the tiles it sent and the tiles that landed in its rack,
 * and everyone's blind counts (shared/exchange/view.ts). From that alone:
 * - What a neighbour passed this seat is what they let go: a suit, winds, dragons or flowers
 *   they keep passing look safe to feed them. A tile they forwarded blind was not their
 *   choice, so a partly blind pass counts for less.
 * - What this seat passed a neighbour stays with them unless it came back: a second north wind
 *   after a first makes two of one wind for them, a 4 bam after a 3 bam a start on a run, a
 *   number in a third suit a number across the suits.
 * - What a neighbour never passes is a guess at what they collect: after six or more tiles from
 *   them, a suit that never came while the other two did, or numbers all of one parity.
 * - A neighbour who forwarded tiles blind seems settled on a hand: feeding them is riskier.
 *
 * The risk is a small score (0 builds on nothing known, half a point is a pair given, below 0
 * is made of what the neighbour passes away) with plain words.
 * These weights are a teaching choice (common practice, no published source), kept small: the
 * advice weighs them beside the odds of finishing, never above them.
 *
 * A little over 300 lines: what the neighbours passed and kept, and the risk words built on that,
 * are one model.
 */
import { PASS_DIRECTION } from '../exchange/constants';
import type { PassRecord, Phase } from '../exchange/types';
import { SEATS, seatFrom, seatTo, type Direction, type Seat } from '../seats';
import { DRAGON_KINDS, rankOf, suitOf, tileName, WIND_KINDS, type Suit, type TileKind } from '../tiles';
import { countOf, joinWords, numberWord, pluralName } from './words';

/** Risk weights, in the units of `PassRisk.score` (common practice, no published source). */
export const DEFENCE = {
  /** Two or more of one kind in one pass: a pair handed over. */
  sameKind: 0.5,
  /** Two of one suit within two numbers in one pass: the start of a run. */
  neighbours: 0.2,
  /** Each flower: many hands use them. */
  flower: 0.15,
  /** One more of a kind this seat already passed them: two of one kind for them. */
  repeatKind: 0.4,
  /** Within two numbers, same suit, of a tile already passed them: a run taking shape. */
  repeatRun: 0.15,
  /** The same number as tiles already passed them in two other suits: a number across the suits. */
  acrossSuits: 0.15,
  /** A tile of a kind, suit or group they seem to collect. */
  collects: 0.25,
  /** A tile of a group they keep passing away: less risk. */
  sheds: -0.15,
  /** A kind they passed this seat themselves. */
  shedKind: -0.25,
  /** They forwarded tiles blind: every risk counts this much more. */
  settled: 1.25,
} as const;

/** Risk levels: up to `low` is low, up to `some` is some, above is high. */
export const RISK_LEVELS = { low: 0.1, some: 0.45 } as const;

/** What the defence reads: the seat, its view of the history, and the kinds of the tile ids it mentions. */
export interface DefenceInput {
  seat: Seat;
  history: readonly PassRecord[];
  kinds: Readonly<Record<string, TileKind>>;
}

/** A group of tiles a neighbour seems to pass away or to collect. */
export interface Trait {
  /** A stable key: 'suit:dot', 'winds', 'dragons', 'flowers', 'evens', 'odds', 'kind:wind-n'. */
  key: string;
  /** Plain words: "dots", "winds", "north winds", "even numbers". */
  words: string;
}

export interface NeighbourRead {
  seat: Seat;
  /** Where they sit from this seat. */
  direction: Direction;
  /** Tiles that landed in this seat's rack from them, in pass order. */
  passedToMe: TileKind[];
  /** How many of those they forwarded blind (not their own choice; which ones is hidden). */
  blindToMe: number;
  /** Tiles this seat passed them and that did not come back. */
  given: TileKind[];
  /** What they keep passing away: safe to feed. */
  sheds: Trait[];
  /** What they seem to collect: risky to feed. */
  collects: Trait[];
  /** They forwarded tiles blind at some pass: they seem settled on a hand. */
  settled: boolean;
  /** What a teacher would say of them, one sentence each. */
  words: string[];
}

export type RiskLevel = 'low' | 'some' | 'high';

export interface PassRisk {
  /** The seat the pass goes to, when the seat is known. */
  to: Seat | null;
  direction: Direction | null;
  level: RiskLevel;
  /** Higher is riskier: 0 is a pass that builds on nothing known, below 0 one made of what the neighbour passes away. */
  score: number;
  /** Why, in plain words, most telling first. */
  words: string[];
}

const DIRECTION_WORDS: Record<Direction, string> = { right: 'the player on your right', across: 'the player across', left: 'the player on your left' };

/** "the player on your right". */
export function neighbourWords(direction: Direction): string {
  return DIRECTION_WORDS[direction];
}

const SUIT_PLURAL: Record<Suit, string> = { bam: 'bams', crack: 'cracks', dot: 'dots' };

/** The traits a tile belongs to, most specific first. */
function traitsOf(kind: TileKind): Trait[] {
  const out: Trait[] = [{ key: `kind:${kind}`, words: pluralName(kind) }];
  const suit = suitOf(kind);
  if (suit) {
    out.push({ key: `suit:${suit}`, words: SUIT_PLURAL[suit] });
    out.push(rankOf(kind)! % 2 === 0 ? { key: 'evens', words: 'even numbers' } : { key: 'odds', words: 'odd numbers' });
  } else if ((WIND_KINDS as readonly TileKind[]).includes(kind)) out.push({ key: 'winds', words: 'winds' });
  else if ((DRAGON_KINDS as readonly TileKind[]).includes(kind)) out.push({ key: 'dragons', words: 'dragons' });
  else if (kind === 'flower') out.push({ key: 'flowers', words: 'flowers' });
  return out;
}

function hasTrait(kind: TileKind, key: string): boolean {
  return traitsOf(kind).some((t) => t.key === key);
}

/** Tiles from a neighbour before they count as a fair sample of what they let go. */
const ENOUGH_SEEN = 6;

/** What each neighbour seems to do, from the seat's own view of the resolved passes. */
export function readNeighbours(input: DefenceInput): NeighbourRead[] {
  const { seat, history, kinds } = input;
  const reads = new Map<Seat, NeighbourRead & { weighted: { kind: TileKind; weight: number }[] }>();
  for (const direction of ['right', 'across', 'left'] as const) {
    const other = seatTo(seat, direction);
    reads.set(other, { seat: other, direction, passedToMe: [], blindToMe: 0, given: [], sheds: [], collects: [], settled: false, words: [], weighted: [] });
  }
  for (const record of history) {
    const direction = PASS_DIRECTION[record.phase];
    if (!direction) continue;
    for (const s of SEATS) if (s !== seat && (record.blind[s] ?? 0) > 0) reads.get(s)!.settled = true;
    const to = reads.get(seatTo(seat, direction))!;
    for (const id of record.sent[seat] ?? []) if (kinds[id]) to.given.push(kinds[id]);
    const from = reads.get(seatFrom(seat, direction))!;
    const landed = (record.received[seat] ?? []).map((id) => kinds[id]).filter((k): k is TileKind => !!k);
    const blind = Math.min(record.blind[from.seat] ?? 0, landed.length);
    from.blindToMe += blind;
    // Which arriving tiles were forwarded blind is hidden: each counts for the share that was chosen.
    const weight = landed.length > 0 ? (landed.length - blind) / landed.length : 0;
    for (const kind of landed) {
      from.passedToMe.push(kind);
      from.weighted.push({ kind, weight });
    }
  }
  const out: NeighbourRead[] = [];
  for (const read of reads.values()) {
    // A tile that came back from them is not with them any more.
    const given = [...read.given];
    for (const kind of read.passedToMe) {
      const at = given.indexOf(kind);
      if (at >= 0) given.splice(at, 1);
    }
    read.given = given;
    const tally = new Map<string, { trait: Trait; weight: number; count: number }>();
    for (const { kind, weight } of read.weighted) {
      for (const trait of traitsOf(kind)) {
        const t = tally.get(trait.key) ?? { trait, weight: 0, count: 0 };
        t.weight += weight;
        t.count++;
        tally.set(trait.key, t);
      }
    }
    const weightOf = (key: string) => tally.get(key)?.weight ?? 0;
    // Passed away: a kind once, a suit or group of honours twice, flowers once.
    for (const { trait, weight } of tally.values()) {
      const need = trait.key.startsWith('kind:') || trait.key === 'flowers' ? 0.99 : trait.key === 'evens' || trait.key === 'odds' ? 2.99 : 1.99;
      if (weight >= need) read.sheds.push(trait);
    }
    // Parity is a lean only when the other parity never came.
    read.sheds = read.sheds.filter((t) => !(t.key === 'evens' && weightOf('odds') > 0) && !(t.key === 'odds' && weightOf('evens') > 0));
    const seen = read.weighted.reduce((sum, w) => sum + w.weight, 0);
    if (seen >= ENOUGH_SEEN - 0.01) {
      const suits = (['bam', 'crack', 'dot'] as const).filter((s) => weightOf(`suit:${s}`) > 0);
      if (suits.length === 2) {
        const missing = (['bam', 'crack', 'dot'] as const).find((s) => !suits.includes(s))!;
        read.collects.push({ key: `suit:${missing}`, words: SUIT_PLURAL[missing] });
      }
      const numbers = weightOf('evens') + weightOf('odds');
      if (numbers >= 4 && weightOf('evens') === 0) read.collects.push({ key: 'evens', words: 'even numbers' });
      if (numbers >= 4 && weightOf('odds') === 0) read.collects.push({ key: 'odds', words: 'odd numbers' });
    }
    read.words = wordsFor(read, seen);
    const { weighted: _weighted, ...clean } = read;
    out.push(clean);
  }
  return out;
}

function wordsFor(read: NeighbourRead, seen: number): string[] {
  const who = neighbourWords(read.direction);
  const words: string[] = [];
  const kinds = read.passedToMe;
  const groups = read.sheds.filter((t) => !t.key.startsWith('kind:'));
  if (groups.length > 0) {
    const shown = groups.slice(0, 2).map((t) => `${numberWord(kinds.filter((k) => hasTrait(k, t.key)).length)} ${t.words}`);
    words.push(`${capital(who)} has passed you ${joinWords(shown)}: they look safe to feed them.`);
  }
  for (const trait of read.collects) {
    words.push(
      trait.key.startsWith('suit:')
        ? `${capital(who)} has passed you ${numberWord(Math.round(seen))} tiles and not one of the ${trait.words}: they may be collecting ${trait.words}.`
        : `Every number ${who} passed you was ${trait.key === 'evens' ? 'odd' : 'even'}: they may be collecting ${trait.words}.`,
    );
  }
  if (read.given.length > 0) words.push(`You have passed ${who} ${joinWords(tally(read.given))}.`);
  if (read.settled) words.push(`${capital(who)} has forwarded tiles blind: they seem settled on a hand.`);
  return words;
}

function tally(kinds: readonly TileKind[]): string[] {
  const counts = new Map<TileKind, number>();
  for (const k of kinds) counts.set(k, (counts.get(k) ?? 0) + 1);
  return [...counts].map(([k, n]) => countOf(k, n));
}

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The seat a pass in this phase goes to, and the direction. */
export function passTarget(seat: Seat | null | undefined, phase: Phase): { to: Seat | null; direction: Direction | null } {
  const direction = PASS_DIRECTION[phase] ?? null;
  return { to: seat && direction ? seatTo(seat, direction) : null, direction };
}

interface RiskPart {
  score: number;
  words: string;
}

/**
 * The risk of passing `tiles` now. `read` is what this seat knows of the neighbour it goes to
 * (readNeighbours), or null when the exchange history is not at hand: then only what the pass
 * itself holds counts (a pair, the start of a run, flowers).
 */
export function passRisk(tiles: readonly TileKind[], direction: Direction | null, read: NeighbourRead | null): PassRisk {
  const who = direction ? neighbourWords(direction) : 'a neighbour';
  const parts: RiskPart[] = [];
  const counts = new Map<TileKind, number>();
  for (const k of tiles) counts.set(k, (counts.get(k) ?? 0) + 1);

  for (const [kind, n] of counts) {
    if (n >= 2 && kind !== 'flower') parts.push({ score: DEFENCE.sameKind * (n - 1), words: `hands ${who} ${countOf(kind, n)} at once` });
  }
  const distinct = [...counts.keys()];
  for (let i = 0; i < distinct.length; i++) {
    for (let j = 0; j < i; j++) {
      const a = distinct[j];
      const b = distinct[i];
      const suit = suitOf(a);
      if (suit && suit === suitOf(b) && Math.abs(rankOf(a)! - rankOf(b)!) <= 2) {
        parts.push({ score: DEFENCE.neighbours, words: `hands ${who} ${countOf(a, 1)} and ${countOf(b, 1)} together, a start on a run` });
      }
    }
  }
  const flowers = counts.get('flower') ?? 0;
  if (flowers > 0) parts.push({ score: DEFENCE.flower * flowers, words: `gives ${who} ${countOf('flower', flowers)}, which many hands use` });

  if (read) {
    const given = read.given;
    for (const kind of distinct) {
      if (kind === 'joker') continue;
      if (given.includes(kind)) {
        parts.push({ score: DEFENCE.repeatKind, words: `with the ${tileName(kind)} you passed ${who} before, this makes ${numberWord(given.filter((k) => k === kind).length + (counts.get(kind) ?? 0))} for them` });
        continue;
      }
      const suit = suitOf(kind);
      if (suit) {
        const near = given.find((g) => suitOf(g) === suit && Math.abs(rankOf(g)! - rankOf(kind)!) <= 2);
        if (near) parts.push({ score: DEFENCE.repeatRun, words: `with the ${tileName(near)} you passed ${who} before, the ${tileName(kind)} starts a run for them` });
        const sameNumber = new Set(given.filter((g) => rankOf(g) === rankOf(kind) && suitOf(g) !== suit).map(suitOf));
        if (sameNumber.size >= 1 && !near) {
          parts.push({ score: DEFENCE.acrossSuits * sameNumber.size, words: `${who} already has ${rankOf(kind)}s in ${numberWord(sameNumber.size)} other suit${sameNumber.size > 1 ? 's' : ''} from you: the ${tileName(kind)} builds a number across the suits` });
        }
      }
    }
    for (const kind of tiles) {
      const collected = read.collects.find((t) => hasTrait(kind, t.key));
      if (collected) parts.push({ score: DEFENCE.collects, words: `${who} never passes ${collected.words}: the ${tileName(kind)} may be what they collect` });
    }
    for (const kind of tiles) {
      if (read.sheds.some((t) => t.key === `kind:${kind}`)) {
        parts.push({ score: DEFENCE.shedKind, words: `${who} passed you ${pluralName(kind)} themselves, so the ${tileName(kind)} looks safe with them` });
        continue;
      }
      const shed = read.sheds.find((t) => !t.key.startsWith('kind:') && t.key !== 'evens' && t.key !== 'odds' && hasTrait(kind, t.key));
      if (shed) parts.push({ score: DEFENCE.sheds, words: `${who} keeps passing ${shed.words}, so the ${tileName(kind)} looks safe with them` });
    }
  }

  let score = parts.reduce((sum, p) => sum + p.score, 0);
  if (read?.settled && score > 0) {
    score *= DEFENCE.settled;
    parts.push({ score: 0, words: `${who} has passed blind before and seems close to a hand` });
  }
  const level: RiskLevel = score <= RISK_LEVELS.low ? 'low' : score <= RISK_LEVELS.some ? 'some' : 'high';
  // The most telling first: the largest risks, then what makes it safe.
  const ordered = [...parts].sort((a, b) => Math.abs(b.score) - Math.abs(a.score));
  return { to: read?.seat ?? null, direction, level, score, words: ordered.map((p) => p.words) };
}

/** One sentence for the advice: the level and the most telling reason. */
export function riskSentence(risk: PassRisk): string {
  const who = risk.direction ? neighbourWords(risk.direction) : 'your neighbour';
  if (risk.words.length === 0) return `Low risk: nothing here builds on what ${who} may collect.`;
  const head = risk.level === 'low' ? 'Low risk' : risk.level === 'some' ? 'Some risk' : 'High risk';
  return `${head}: ${risk.words[0]}.`;
}
