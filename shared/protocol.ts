/**
 * What travels between client and server: REST payloads and socket events, with their zod schemas
 * and one ack type per event. Long (a little over 300 lines) because the whole wire is kept in this
 * one file on purpose; the accounts part (roles, limits, sign-in) is the first to move out if it grows.
 */
import { z } from 'zod';
import type { CommittedPass, ExchangeOptions, ExchangeView, LogEntry, Phase } from './exchange/types';
import type { Seat } from './seats';
import type { Tile } from './tiles';
import type { Pattern } from './analysis/pattern';
import { BOT_STRATEGY_IDS } from './bot-ids';

export const ROLE_NAMES = ['player', 'teacher', 'admin'] as const;
export type RoleName = (typeof ROLE_NAMES)[number];

export const LIMITS = {
  emailMax: 254,
  passwordMin: 8,
  passwordMax: 200,
  displayNameMax: 60,
} as const;

const email = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .max(LIMITS.emailMax, `An e-mail address has at most ${LIMITS.emailMax} characters.`)
  .pipe(z.email({ error: 'That does not look like an e-mail address (name@example.test).' }));

export const registerSchema = z.object({
  email,
  password: z
    .string({ error: 'Choose a password.' })
    .min(LIMITS.passwordMin, `Use at least ${LIMITS.passwordMin} characters for your password.`)
    .max(LIMITS.passwordMax, `A password has at most ${LIMITS.passwordMax} characters.`),
  displayName: z
    .string({ error: 'Tell us the name to show at the table.' })
    .trim()
    .min(1, 'Tell us the name to show at the table.')
    .max(LIMITS.displayNameMax, `A name has at most ${LIMITS.displayNameMax} characters.`),
});
export type RegisterInput = z.input<typeof registerSchema>;

export const loginSchema = z.object({
  email,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(LIMITS.passwordMax, `A password has at most ${LIMITS.passwordMax} characters.`),
});
export type LoginInput = z.input<typeof loginSchema>;

export const roleChangeSchema = z.object({
  role: z.enum(ROLE_NAMES, { error: `A role is one of: ${ROLE_NAMES.join(', ')}.` }),
});

export interface UserDto {
  id: number;
  email: string;
  displayName: string;
  role: RoleName;
  createdAt: string;
}

export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

// ───────────────────────── Live tables ─────────────────────────

export const SEAT_NAMES = ['east', 'south', 'west', 'north'] as const;

export const TABLE_LIMITS = { nameMax: 80, seedMax: 120, chatMax: 500, noteMax: 2000 } as const;

/** Options a host picks when opening a table. */
export const tableOptionsSchema = z
  .object({
    seed: z.string().trim().min(1, 'A seed needs at least one character.').max(TABLE_LIMITS.seedMax, `A seed has at most ${TABLE_LIMITS.seedMax} characters.`).optional(),
    jokers: z.boolean().optional(),
    secondCharleston: z.boolean().optional(),
    courtesy: z.boolean().optional(),
    /** Hold every pass in a huddle once all four have committed. */
    huddleEveryPass: z.boolean().optional(),
    /** The host sees every rack all the time. */
    teaching: z.boolean().optional(),
    /** Hide the pass advice from the players (a test of skill). */
    hideAdvice: z.boolean().optional(),
    /** Bots always vote for the second Charleston (a practice table wants all six passes). */
    botsPlaySecond: z.boolean().optional(),
    /** The pattern list the table's analysis and bots use: "starter" or one of the host's own lists. */
    patternListId: z.string().trim().min(1, 'Pick a pattern list.').max(64).optional(),
  })
  .strict();
export type TableOptionsInput = z.input<typeof tableOptionsSchema>;

export const createTableSchema = z
  .object({
    name: z.string({ error: 'Give the table a name.' }).trim().min(1, 'Give the table a name.').max(TABLE_LIMITS.nameMax, `A table name has at most ${TABLE_LIMITS.nameMax} characters.`),
    private: z.boolean().optional(),
    options: tableOptionsSchema.optional(),
    /** Deal from one of the host's drills: its seed, preset racks, parts and pattern list. */
    drillId: z.string().trim().min(1, 'Pick a drill.').max(64).optional(),
  })
  .strict();
export type CreateTableInput = z.input<typeof createTableSchema>;

export interface TableOptions {
  /** Only the host sees a fixed seed; others get null and `seedHidden`. */
  seed: string | null;
  seedHidden?: boolean;
  jokers: boolean;
  secondCharleston: boolean;
  courtesy: boolean;
  huddleEveryPass: boolean;
  teaching: boolean;
  hideAdvice: boolean;
  /** Bots always vote for the second Charleston. */
  botsPlaySecond: boolean;
  /** The pattern list for analysis and bots; absent means the starter list. */
  patternListId?: string;
  /** The drill the table deals from, if any (its preset racks stay on the server). */
  drillId?: string;
  drillName?: string;
}

export type TableStatus = 'lobby' | 'playing' | 'done' | 'closed';

export type SeatOccupant =
  /** `awaySince`: when a seated player's last connection closed (ISO), while they are gone. */
  | { kind: 'user'; userId: number; displayName: string; connected: boolean; awaySince?: string | null }
  /** `standsInFor`: the player this bot keeps the seat warm for; they can take it back. */
  | { kind: 'bot'; strategy: string; displayName: string; standsInFor?: { userId: number; displayName: string } };

export interface TableDto {
  id: string;
  name: string;
  hostId: number;
  hostName: string;
  private: boolean;
  status: TableStatus;
  options: TableOptions;
  seats: Record<Seat, SeatOccupant | null>;
  /** Only for the host: the code that lets others into a private table. */
  inviteCode?: string;
  currentExchangeId: string | null;
  createdAt: string;
}

export interface HuddleNoteDto {
  id: number;
  /** How many passes had resolved when the note was written: the pass it belongs to is the next one. */
  passIndex: number;
  phase: Phase;
  seat: Seat | null;
  authorName: string;
  text: string;
  createdAt: string;
}

export interface HuddleState {
  open: boolean;
  /** Seats the host has shown to the table: their rack and their committed pass. */
  revealed: Partial<Record<Seat, { rack: Tile[]; pass: CommittedPass | null }>>;
  notes: HuddleNoteDto[];
}

export interface SeatStateDto {
  occupant: SeatOccupant | null;
  committed: boolean;
  rackSize: number;
}

/** What `table:state` carries: one viewer's own view of one table. */
export interface TableStateDto {
  tableId: string;
  name: string;
  version: number;
  phase: Phase | 'lobby';
  status: TableStatus;
  hostId: number;
  isHost: boolean;
  mySeat: Seat | null;
  myRack: Tile[];
  seats: Record<Seat, SeatStateDto>;
  options: TableOptions;
  exchangeId: string | null;
  /** The engine's view for this viewer (null in the lobby). */
  view: ExchangeView | null;
  huddle: HuddleState;
  spectators: number;
  inviteCode?: string;
}

export interface ChatMessageDto {
  id: string;
  tableId: string;
  userId: number;
  displayName: string;
  seat: Seat | null;
  text: string;
  at: string;
}

export interface ExchangeSummaryDto {
  id: string;
  tableId: string;
  tableName: string;
  seat: Seat | null;
  status: 'playing' | 'done';
  startedAt: string;
  finishedAt: string | null;
  /** For a finished exchange where the viewer sat: the fewest tiles away from the table's pattern list after the deal, and at the end. */
  awayBefore?: number | null;
  awayAfter?: number | null;
  /** The odds (0–1) of finishing the likeliest pattern from the dealt rack, and from the final one. */
  oddsBefore?: number | null;
  oddsAfter?: number | null;
  /** The pattern the viewer's final rack is nearest to. */
  nearestPattern?: string | null;
  /** For a finished exchange: how many exchanges of its host were dealt the same deal, itself included (1: nothing to compare yet). */
  sameDeal?: number;
}

/** Everything a replay needs: the client rebuilds each step with the shared engine. */
export interface ExchangeReplayDto {
  id: string;
  tableId: string;
  tableName: string;
  /** The engine's options (its seed reproduces this deal only) and the seed name the host gave, if any. */
  options: ExchangeOptions & { seedName?: string | null };
  log: LogEntry[];
  /** The pattern list the table judged racks by, which the replay judges by too. */
  patternList: { id: string; name: string; patterns: Pattern[] };
  seats: Record<Seat, { displayName: string; kind: 'user' | 'bot'; strategy?: string }>;
  notes: HuddleNoteDto[];
  startedAt: string;
  finishedAt: string | null;
}

// Socket payloads. Every client event answers through an ack.
const seat = z.enum(SEAT_NAMES, { error: 'A seat is east, south, west or north.' });
// Widened to string for what the client sends (its bot picker holds a string); the server still takes only these ids.
const botStrategyIds: readonly [string, ...string[]] = BOT_STRATEGY_IDS;
const tileIds = z.array(z.string().min(1).max(16)).max(3);

export const actionSchema = z.discriminatedUnion(
  'type',
  [
    z.object({ type: z.literal('pass'), tiles: tileIds, blind: z.number().int().min(0).max(3).optional() }).strict(),
    z.object({ type: z.literal('withdraw') }).strict(),
    z.object({ type: z.literal('vote'), stop: z.boolean() }).strict(),
    z.object({ type: z.literal('courtesy-ask'), count: z.union([z.literal(0), z.literal(1), z.literal(2), z.literal(3)]) }).strict(),
  ],
  { error: 'An action is a pass, withdraw, vote or courtesy-ask.' },
);

export const clientEventSchemas = {
  'table:join': z.object({ tableId: z.string().min(1).max(64), as: z.enum(['player', 'spectator']).default('player'), invite: z.string().max(64).optional() }).strict(),
  'table:sit': z.object({ seat }).strict(),
  'table:stand': z.object({}).strict().default({}),
  'table:bot': z.object({ seat, strategy: z.enum(botStrategyIds, { error: `A bot strategy is one of: ${BOT_STRATEGY_IDS.join(', ')}.` }) }).strict(),
  'table:start': z.object({}).strict().default({}),
  'exchange:act': z.object({ action: actionSchema, version: z.number().int().nonnegative().optional() }).strict(),
  'huddle:call': z.object({}).strict().default({}),
  'huddle:reveal': z.object({ seat }).strict(),
  'huddle:note': z.object({ text: z.string().trim().min(1, 'A note needs some text.').max(TABLE_LIMITS.noteMax), seat: seat.optional() }).strict(),
  'huddle:release': z.object({}).strict().default({}),
  'table:leave': z.object({}).strict().default({}),
  /** Host: show or hide the pass advice for the players. */
  'table:advice': z.object({ hidden: z.boolean() }).strict(),
  /** Host: close the table for good (not while an exchange is under way); its exchanges stay in history. */
  'table:close': z.object({}).strict().default({}),
  'chat:send': z.object({ text: z.string().trim().min(1, 'Say something first.').max(TABLE_LIMITS.chatMax, `A message has at most ${TABLE_LIMITS.chatMax} characters.`) }).strict(),
} as const;

export type ClientEventName = keyof typeof clientEventSchemas;
export type ClientPayload<E extends ClientEventName> = z.input<(typeof clientEventSchemas)[E]>;

export type AckError = { ok: false; code: string; message: string };
/** An answer with any payload; `AckOf` names the one a given event answers with. */
export type Ack<T extends object = object> = ({ ok: true } & T) | AckError;

/** The table's version once the change is stored and shown. */
type Versioned = { version: number };
type Nothing = Record<never, never>;

/** What each client event answers with when it succeeds (a refusal is an `AckError`). */
export type AckPayloads = {
  /** The joiner's own view of the table, as sent to them. */
  'table:join': { state: TableStateDto };
  'table:sit': Versioned;
  'table:stand': Versioned;
  'table:bot': Versioned;
  'table:start': Versioned;
  'exchange:act': Versioned;
  'huddle:call': Versioned;
  'huddle:reveal': Versioned;
  'huddle:note': Versioned;
  'huddle:release': Versioned;
  'table:leave': Nothing;
  'table:advice': Versioned;
  'table:close': Versioned;
  /** The id the message was sent with, as every reader gets it in `chat:message`. */
  'chat:send': { id: string };
};

/** The ack of one client event. */
export type AckOf<E extends ClientEventName> = Ack<AckPayloads[E]>;

export type ClientToServerEvents = {
  [E in ClientEventName]: (payload: ClientPayload<E>, ack: (ack: AckOf<E>) => void) => void;
};

export interface ServerToClientEvents {
  'table:state': (state: TableStateDto) => void;
  'chat:message': (message: ChatMessageDto) => void;
}
