/** Lessons, invitations, paid seats, the mail outbox and password resets: wire schemas and DTOs. */
import { z } from 'zod';
import { LIMITS, TABLE_LIMITS } from './protocol';
import type { Seat } from './seats';

export const LESSON_LIMITS = {
  titleMax: 100,
  descriptionMax: 2000,
  durationMin: 15,
  durationMax: 240,
  seatsMin: 1,
  seatsMax: 32,
  /** The smallest and largest price a seat may have, in the currency's minor unit (cents). */
  priceMin: 100,
  priceMax: 100_000,
  drillsMax: 8,
  invitesPerRequest: 40,
} as const;

export const CURRENCIES = ['usd', 'eur', 'gbp', 'cad'] as const;
export type Currency = (typeof CURRENCIES)[number];

/** "2026-05-12T19:00": a wall-clock time in the lesson's own time zone. */
const LOCAL_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/;

const email = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(LIMITS.emailMax, `An e-mail address has at most ${LIMITS.emailMax} characters.`)
  .pipe(z.email({ error: 'That does not look like an e-mail address (name@example.test).' }));

export const lessonInputSchema = z
  .object({
    title: z
      .string({ error: 'Give the lesson a title.' })
      .trim()
      .min(1, 'Give the lesson a title.')
      .max(LESSON_LIMITS.titleMax, `A title has at most ${LESSON_LIMITS.titleMax} characters.`),
    description: z.string().trim().max(LESSON_LIMITS.descriptionMax, `A description has at most ${LESSON_LIMITS.descriptionMax} characters.`).default(''),
    startsAtLocal: z
      .string({ error: 'Pick the day and time the lesson starts.' })
      .regex(LOCAL_TIME, 'Pick the day and time the lesson starts (for example 2026-05-12T19:00).'),
    timeZone: z.string({ error: 'Pick the time zone the start time is in.' }).min(1, 'Pick the time zone the start time is in.').max(64),
    durationMinutes: z
      .number({ error: 'Say how long the lesson lasts, in minutes.' })
      .int('Give the length in whole minutes.')
      .min(LESSON_LIMITS.durationMin, `A lesson lasts at least ${LESSON_LIMITS.durationMin} minutes.`)
      .max(LESSON_LIMITS.durationMax, `A lesson lasts at most ${LESSON_LIMITS.durationMax} minutes.`),
    seats: z
      .number({ error: 'Say how many students may take part.' })
      .int('Give the seats as a whole number.')
      .min(LESSON_LIMITS.seatsMin, 'A lesson needs at least one seat.')
      .max(LESSON_LIMITS.seatsMax, `A lesson has at most ${LESSON_LIMITS.seatsMax} seats.`),
    /** 0 means free; otherwise the price of one seat in cents. */
    priceCents: z
      .number({ error: 'Give a price, or mark the lesson free.' })
      .int('Give the price in whole cents.')
      .refine((n) => n === 0 || (n >= LESSON_LIMITS.priceMin && n <= LESSON_LIMITS.priceMax), {
        error: `A priced seat costs between ${LESSON_LIMITS.priceMin / 100} and ${LESSON_LIMITS.priceMax / 100}; or mark the lesson free.`,
      }),
    currency: z.enum(CURRENCIES, { error: `A currency is one of: ${CURRENCIES.join(', ')}.` }).default('usd'),
    /** The drills to play, in order; or leave empty and name a seed. */
    drillIds: z
      .array(z.string().trim().min(1).max(64), { error: 'Drills are a list of drill ids.' })
      .max(LESSON_LIMITS.drillsMax, `A lesson plays at most ${LESSON_LIMITS.drillsMax} drills.`)
      .default([]),
    seed: z
      .string()
      .trim()
      .max(TABLE_LIMITS.seedMax, `A seed has at most ${TABLE_LIMITS.seedMax} characters.`)
      .optional()
      .transform((s) => (s ? s : undefined)),
  })
  .strict()
  .superRefine((lesson, ctx) => {
    if (!lesson.drillIds.length && !lesson.seed) {
      ctx.addIssue({ code: 'custom', path: ['seed'], message: 'Pick a drill, or name a seed such as harbor-lane-week-01, so every table gets the same deal.' });
    }
  });
export type LessonInput = z.input<typeof lessonInputSchema>;

export const invitationsInputSchema = z
  .object({
    emails: z
      .array(email, { error: 'List the e-mail addresses to invite.' })
      .min(1, 'Enter at least one e-mail address.')
      .max(LESSON_LIMITS.invitesPerRequest, `Invite at most ${LESSON_LIMITS.invitesPerRequest} people at a time.`),
  })
  .strict();

export const roomInputSchema = z
  .object({
    /** How many tables to split the students over; by default as few as hold everyone. */
    tables: z.number().int('Give a whole number of tables.').min(1, 'Use at least one table.').max(8, 'Use at most 8 tables.').optional(),
    bot: z.enum(['random', 'multiples', 'advised'], { error: 'A bot is random, multiples or advised.' }).default('advised'),
    /** Which of the lesson's drills to deal; by default its first. */
    drillId: z.string().trim().min(1).max(64).optional(),
    /** Hold every pass in a huddle until the teacher lets it go. */
    holdEveryPass: z.boolean().default(false),
  })
  .strict();

export const checkoutInputSchema = z.object({ lessonId: z.number({ error: 'Name the lesson to pay for.' }).int().positive() }).strict();

export const passwordResetRequestSchema = z.object({ email }).strict();
export const passwordResetConfirmSchema = z
  .object({
    token: z.string({ error: 'This reset link is incomplete. Open the link from the e-mail again.' }).min(10).max(400),
    password: z
      .string({ error: 'Choose a new password.' })
      .min(LIMITS.passwordMin, `Use at least ${LIMITS.passwordMin} characters for your password.`)
      .max(LIMITS.passwordMax, `A password has at most ${LIMITS.passwordMax} characters.`),
  })
  .strict();

export type EnrollmentStatus = 'invited' | 'enrolled' | 'paid';
export type PaymentStatus = 'pending' | 'paid' | 'refund-due' | 'refunded' | 'expired' | 'failed';

export interface LessonDto {
  id: number;
  title: string;
  description: string;
  teacherId: number;
  teacherName: string;
  startsAt: string;
  timeZone: string;
  durationMinutes: number;
  seats: number;
  /** Seats spoken for: every accepted student of a free lesson; in a priced one every paid student plus every student holding one. */
  seatsTaken: number;
  /** Of `seatsTaken`, those only held while a student is on the payment page (a student counts once); 0 in a free lesson. */
  seatsHeld: number;
  /** When the last of those holds ends, if any seat is held. */
  holdEndsAt: string | null;
  priceCents: number;
  currency: Currency;
  drillIds: string[];
  seed: string | null;
  /** The viewer's own place in the lesson, if any. */
  myStatus: EnrollmentStatus | null;
  isTeacher: boolean;
}

export interface EnrollmentDto {
  userId: number;
  displayName: string;
  email: string;
  status: EnrollmentStatus;
}

export interface InvitationDto {
  id: number;
  email: string;
  expiresAt: string;
  usedAt: string | null;
}

export interface LessonDetailDto extends LessonDto {
  /** Teacher and admins only. */
  enrollments?: EnrollmentDto[];
  invitations?: InvitationDto[];
}

export interface RoomTableDto {
  id: string;
  name: string;
  index: number;
  status: 'lobby' | 'playing' | 'done' | 'closed';
  seats: Record<Seat, { kind: 'user' | 'bot'; displayName: string; userId?: number } | null>;
  seed: string | null;
  drillId: string | null;
}

export interface InvitationPreviewDto {
  lesson: Pick<LessonDto, 'id' | 'title' | 'teacherName' | 'startsAt' | 'timeZone' | 'durationMinutes' | 'priceCents' | 'currency'>;
  /** The address it was sent to, partly hidden. */
  emailHint: string;
  expiresAt: string;
}

export interface ReceiptDto {
  id: number;
  status: PaymentStatus;
  amountCents: number;
  currency: Currency;
  lesson: Pick<LessonDto, 'id' | 'title' | 'teacherName' | 'startsAt' | 'timeZone'>;
  payerName: string;
  paidAt: string | null;
  refundedAt: string | null;
  checkoutSessionId: string | null;
  message: string;
}

export interface MailDto {
  id: number;
  to: string;
  from: string;
  subject: string;
  kind: string | null;
  receivedAt: string;
  text?: string;
  html?: string | null;
}

/** "$12.50", "€12.50": one way to write an amount, on both sides. */
export function formatMoney(cents: number, currency: string): string {
  return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}
