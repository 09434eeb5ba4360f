import { Link } from 'react-router-dom';
import { formatMoney, type LessonDto } from '../../../../shared/lessons';
import { lessonTimes } from '../lesson-time';
import { countWord } from '../../../lib/phase-words';

const STATUS_WORDS = { invited: 'Invited', enrolled: 'Accepted', paid: 'Paid' } as const;

export function lessonPrice(lesson: Pick<LessonDto, 'priceCents' | 'currency'>) {
  return lesson.priceCents ? formatMoney(lesson.priceCents, lesson.currency) : 'Free';
}

const sameDay = (a: Date, b: Date) => a.toDateString() === b.toDateString();

/** When a hold ends, on the reader's clock; with the day when that is not today. */
function holdEnd(iso: string, now: Date): string {
  const end = new Date(iso);
  const options: Intl.DateTimeFormatOptions = sameDay(end, now) ? { timeStyle: 'short' } : { dateStyle: 'medium', timeStyle: 'short' };
  return new Intl.DateTimeFormat(undefined, options).format(end);
}

/**
 * "1 of 4 seats paid · 1 held until 18:40 while a student pays": in a priced lesson a seat held by an
 * open checkout is not a paid seat, and it comes free again when the hold ends.
 */
export function seatWords(lesson: Pick<LessonDto, 'seats' | 'seatsTaken' | 'seatsHeld' | 'holdEndsAt' | 'priceCents'>, now = new Date()): string {
  if (!lesson.priceCents) return `${lesson.seatsTaken} of ${countWord(lesson.seats, 'seat')} taken`;
  const held = lesson.seatsHeld;
  const paid = `${lesson.seatsTaken - held} of ${countWord(lesson.seats, 'seat')} paid`;
  if (!held) return paid;
  const until = lesson.holdEndsAt ? holdEnd(lesson.holdEndsAt, now) : null;
  if (held === 1) return `${paid} · 1 held${until ? ` until ${until}` : ''} while a student pays`;
  return `${paid} · ${held} held while students pay${until ? `, until ${until} at the latest` : ''}`;
}

export function LessonList({ lessons, empty }: { lessons: LessonDto[]; empty: string }) {
  if (!lessons.length) return <p className="text-ink-soft">{empty}</p>;
  return (
    <ul className="flex flex-col gap-3">
      {lessons.map((lesson) => {
        const { there, here } = lessonTimes(lesson.startsAt, lesson.timeZone);
        return (
          <li key={lesson.id} className="rounded-lg border-2 border-line/60 bg-card p-4">
            <Link to={`/lessons/${lesson.id}`} className="text-lead font-semibold">
              {lesson.title}
            </Link>
            <p>{there}</p>
            {here && <p className="text-ink-soft">{here}</p>}
            <p>
              {lesson.durationMinutes} minutes · {lessonPrice(lesson)} · {seatWords(lesson)}
              {lesson.myStatus && <> · <strong>{STATUS_WORDS[lesson.myStatus]}</strong></>}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
