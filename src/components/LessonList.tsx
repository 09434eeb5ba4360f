import { Link } from 'react-router-dom';
import { formatMoney, type LessonDto } from '../../shared/lessons';
import { lessonTimes } from './lessonTime';

const STATUS_WORDS = { invited: 'Invited', enrolled: 'Accepted', paid: 'Paid' } as const;

export function lessonPrice(lesson: Pick<LessonDto, 'priceCents' | 'currency'>) {
  return lesson.priceCents ? formatMoney(lesson.priceCents, lesson.currency) : 'Free';
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
              {lesson.durationMinutes} minutes · {lessonPrice(lesson)} · {lesson.seatsTaken} of {lesson.seats} seats taken
              {lesson.myStatus && <> · <strong>{STATUS_WORDS[lesson.myStatus]}</strong></>}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
