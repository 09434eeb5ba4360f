import { Link, useParams, useSearchParams } from 'react-router-dom';
import { formatMoney } from '../../../../shared/lessons';
import { useMe } from '../../../lib/api/auth';
import { useReceipt } from '../api/payments';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { lessonTimes } from '../lesson-time';
import { SignInFirst } from '../../../components/ui/SignInFirst';

const HEADINGS = { pending: 'Confirming your payment…', paid: 'Receipt', 'refund-due': 'Refund on its way', refunded: 'Refunded', expired: 'Checkout expired', failed: 'Payment not matched' } as const;

/** Where the payment service sends the student back: the receipt, once the webhook has landed. */
export function ReceiptPage() {
  const lessonId = useParams().id!;
  const sessionId = useSearchParams()[0].get('session_id') ?? '';
  const { data: me, isPending } = useMe();
  const receipt = useReceipt(sessionId);
  if (isPending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (!sessionId) return <FormMessage error>This address is missing its checkout reference. Open the lesson page to see whether your seat is paid.</FormMessage>;
  if (receipt.error) return <FormMessage error>{receipt.error.message}</FormMessage>;
  if (!receipt.data) return <p role="status">Loading…</p>;
  const r = receipt.data;
  const { there } = lessonTimes(r.lesson.startsAt, r.lesson.timeZone);
  return (
    <Card className="mx-auto max-w-xl">
      <h1 className="mb-4 text-title font-semibold">{HEADINGS[r.status]}</h1>
      <div role="status" aria-live="polite" className="mb-4">
        <FormMessage error={r.status !== 'paid' && r.status !== 'pending'}>{r.message}</FormMessage>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2">
        <dt className="font-medium">Lesson</dt>
        <dd>{r.lesson.title}</dd>
        <dt className="font-medium">Teacher</dt>
        <dd>{r.lesson.teacherName}</dd>
        <dt className="font-medium">Starts</dt>
        <dd>{there}</dd>
        <dt className="font-medium">Amount</dt>
        <dd>{formatMoney(r.amountCents, r.currency)}</dd>
        <dt className="font-medium">Paid by</dt>
        <dd>{r.payerName}</dd>
        {r.paidAt && (
          <>
            <dt className="font-medium">Paid on</dt>
            <dd>{new Date(r.paidAt).toLocaleString()}</dd>
          </>
        )}
        {r.refundedAt && (
          <>
            <dt className="font-medium">Refunded on</dt>
            <dd>{new Date(r.refundedAt).toLocaleString()}</dd>
          </>
        )}
        <dt className="font-medium">Receipt number</dt>
        <dd>R-{r.id}</dd>
      </dl>
      <p className="mt-6">
        <Link to={`/lessons/${lessonId}`}>Back to the lesson</Link>
      </p>
    </Card>
  );
}
