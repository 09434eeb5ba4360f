import { useMe } from '../../../lib/api/auth';
import { useLessons } from '../api/lessons';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { LessonList } from '../components/LessonList';
import { ScheduleLessonForm } from '../components/ScheduleLessonForm';
import { SignInFirst } from '../../../components/ui/SignInFirst';

export function LessonsPage() {
  const { data: me, isPending } = useMe();
  const lessons = useLessons(Boolean(me));
  if (isPending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  const teaches = me.role === 'teacher' || me.role === 'admin';
  return (
    <div className="flex flex-col gap-8">
      <h1 className="text-title font-semibold">Lessons</h1>
      {lessons.error && <FormMessage error>{lessons.error.message}</FormMessage>}
      {teaches && (
        <Card>
          <ScheduleLessonForm />
        </Card>
      )}
      {teaches && (
        <section aria-labelledby="teaching-title" className="flex flex-col gap-3">
          <h2 id="teaching-title" className="text-lead font-semibold">
            Lessons I teach
          </h2>
          {lessons.data ? <LessonList lessons={lessons.data.teaching} empty="No lessons yet. Schedule one above." /> : <p role="status">Loading…</p>}
        </section>
      )}
      <section aria-labelledby="attending-title" className="flex flex-col gap-3">
        <h2 id="attending-title" className="text-lead font-semibold">
          Lessons I take part in
        </h2>
        {lessons.data ? (
          <LessonList lessons={lessons.data.attending} empty="None yet. When a teacher invites you, the e-mail has a link that brings you here." />
        ) : (
          <p role="status">Loading…</p>
        )}
      </section>
    </div>
  );
}
