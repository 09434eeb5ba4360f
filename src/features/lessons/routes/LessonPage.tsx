import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useMe } from '../../../lib/api/auth';
import { ApiError } from '../../../lib/api/client';
import { useLesson } from '../api/lessons';
import { useDrills } from '../../../lib/api/drill-list';
import { useCheckout } from '../api/payments';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { InviteForm } from '../components/InviteForm';
import { lessonPrice, seatWords } from '../components/LessonList';
import { LessonRoom } from '../components/LessonRoom';
import { lessonTimes } from '../lesson-time';
import { SignInFirst } from '../../../components/ui/SignInFirst';

const isPast = (iso: string) => new Date(iso).getTime() < Date.now();

const ENROLLMENT_WORDS = { invited: 'Invited, not yet accepted', enrolled: 'Accepted', paid: 'Paid' } as const;

export function LessonPage() {
  const id = useParams().id!;
  const [params] = useSearchParams();
  const { data: me, isPending: mePending } = useMe();
  const lesson = useLesson(id);
  const checkout = useCheckout();
  // The teacher reads the deal by the drills' names, not their ids.
  const drills = useDrills(Boolean(lesson.data?.enrollments));
  if (mePending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (lesson.error) {
    return (
      <Card className="mx-auto max-w-lg">
        <h1 className="mb-3 text-title font-semibold">This lesson is not open to you</h1>
        <FormMessage error>{lesson.error.message}</FormMessage>
      </Card>
    );
  }
  if (!lesson.data) return <p role="status">Loading…</p>;
  const l = lesson.data;
  const teaches = Boolean(l.enrollments);
  const { there, here } = lessonTimes(l.startsAt, l.timeZone);
  const mustPay = !teaches && l.priceCents > 0 && l.myStatus === 'enrolled';
  const holdsSeat = l.myStatus === 'paid' || (l.priceCents === 0 && l.myStatus === 'enrolled');
  const checkoutError = checkout.error instanceof ApiError ? checkout.error.message : checkout.error ? 'The payment page could not be opened.' : null;

  return (
    <div className="flex flex-col gap-6">
      <Card>
        <h1 className="mb-2 text-title font-semibold">{l.title}</h1>
        <p className="text-lead">{there}</p>
        {here && <p className="text-ink-soft">{here}</p>}
        <p>
          {l.durationMinutes} minutes with {l.teacherName} · {lessonPrice(l)} · {seatWords(l)}
        </p>
        {l.description && <p className="mt-3 whitespace-pre-line">{l.description}</p>}
        {teaches && (
          <p className="mt-3 text-ink-soft">
            Deal: {l.drillIds.length ? `drill ${l.drillIds.map((d) => `“${drills.data?.find((x) => x.id === d)?.name ?? d}”`).join(', ')}` : `seed ${l.seed}`}
          </p>
        )}
        {!teaches && l.myStatus && (
          <p className="mt-3">
            Your place: <strong>{ENROLLMENT_WORDS[l.myStatus]}</strong>
          </p>
        )}
      </Card>

      {params.get('checkout') === 'cancelled' && <FormMessage>You left the payment page without paying. Nothing was charged.</FormMessage>}
      {mustPay && (
        <Card>
          <h2 className="mb-2 text-lead font-semibold">Pay for your seat</h2>
          <p className="mb-4">You pay {lessonPrice(l)} on the payment service&apos;s own page; Rackside never sees your card.</p>
          {checkoutError && <FormMessage error>{checkoutError}</FormMessage>}
          <Button kind="primary" onClick={() => checkout.mutate(l.id)} disabled={checkout.isPending}>
            {checkout.isPending ? 'Opening the payment page…' : `Pay ${lessonPrice(l)} for my seat`}
          </Button>
        </Card>
      )}

      {teaches && (
        <Card>
          <InviteForm lessonId={id} />
        </Card>
      )}
      {teaches && (
        <Card>
          <h2 className="mb-3 text-lead font-semibold">Students</h2>
          {l.enrollments!.length ? (
            <table className="w-full text-left">
              <thead>
                <tr>
                  <th scope="col">Name</th>
                  <th scope="col">E-mail</th>
                  <th scope="col">Place</th>
                  <th scope="col">
                    <span className="sr-only">Progress</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {l.enrollments!.map((e) => (
                  <tr key={e.userId} className="border-t border-line/40">
                    <td className="py-2">{e.displayName}</td>
                    <td className="py-2 break-all">{e.email}</td>
                    <td className="py-2">{ENROLLMENT_WORDS[e.status]}</td>
                    <td className="py-2">
                      {e.status !== 'invited' && (
                        <Link to={`/progress/${e.userId}`} aria-label={`Progress of ${e.displayName}`}>
                          Progress
                        </Link>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p>Nobody yet. Invite students above.</p>
          )}
          {l.invitations!.length > 0 && (
            <>
              <h3 className="mt-4 font-semibold">Invitations sent</h3>
              <ul>
                {l.invitations!.map((i) => (
                  <li key={i.id}>
                    {i.email}: {i.usedAt ? 'accepted' : isPast(i.expiresAt) ? 'expired or replaced' : `open until ${new Date(i.expiresAt).toLocaleString()}`}
                  </li>
                ))}
              </ul>
            </>
          )}
        </Card>
      )}
      {(teaches || holdsSeat) && (
        <Card>
          <LessonRoom lessonId={id} isTeacher={teaches} />
          <p className="mt-4">
            <Link to={`/compare/lessons/${id}`} className="font-semibold">
              Compare the tables of this lesson
            </Link>{' '}
            <span className="text-ink-soft">(each table&apos;s passes side by side, once it has finished)</span>
          </p>
        </Card>
      )}
    </div>
  );
}
