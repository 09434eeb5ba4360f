import { useState } from 'react';
import { useMail, useOutbox } from '../api/mail';
import { useMe } from '../../../lib/api/auth';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { TeacherOnly } from '../../../components/ui/TeacherOnly';

/** When a message was sent, on the reader's own clock and in their own way of writing dates. */
const sentAt = (iso: string) => new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso));

const KIND_WORDS: Record<string, string> = { invitation: 'Invitation', 'password-reset': 'Password reset', receipt: 'Receipt', refund: 'Refund' };

function MailBody({ id }: { id: number }) {
  const mail = useMail(id);
  if (mail.error) return <FormMessage error>{mail.error.message}</FormMessage>;
  if (!mail.data) return <p role="status">Loading…</p>;
  return (
    <article aria-labelledby="mail-subject" className="flex flex-col gap-2">
      <h2 id="mail-subject" className="text-lead font-semibold">
        {mail.data.subject}
      </h2>
      <p>
        To {mail.data.to} · from {mail.data.from} · sent <time dateTime={mail.data.receivedAt}>{sentAt(mail.data.receivedAt)}</time>
      </p>
      {/* The plain-text part, with its links made clickable: the HTML part is never rendered here. */}
      <div className="whitespace-pre-wrap break-words rounded-lg border-2 border-line/60 bg-paper p-4">
        {mail.data.text!.split(/(https?:\/\/\S+)/).map((part, i) => (i % 2 ? <a key={i} href={part}>{part}</a> : part))}
      </div>
    </article>
  );
}

/** What the local mail fake received: for checking invitations and resets without a real inbox. */
export function OutboxPage() {
  const { data: me } = useMe();
  const outbox = useOutbox(me?.role === 'teacher' || me?.role === 'admin');
  const [open, setOpen] = useState<number | null>(null);
  return (
    <TeacherOnly what="Mail pages">
      <div className="flex flex-col gap-6">
        <h1 className="text-title font-semibold">Mail sent</h1>
        <p>
          {me?.role === 'admin' ? 'Every message' : 'The messages your lessons sent'} as the local mail server received them. In development nothing leaves this machine.
        </p>
        {outbox.error && <FormMessage error>{outbox.error.message}</FormMessage>}
        {outbox.data && outbox.data.length === 0 && <p>No mail yet.</p>}
        <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <ul className="flex flex-col gap-2">
            {(outbox.data ?? []).map((m) => (
              <li key={m.id}>
                <Button kind={open === m.id ? 'primary' : 'plain'} aria-pressed={open === m.id} className="w-full text-left" onClick={() => setOpen(m.id)}>
                  <span className="block">{m.subject}</span>
                  <span className="block font-normal">
                    {KIND_WORDS[m.kind ?? ''] ?? 'Message'} to {m.to}
                  </span>
                  <span className="block font-normal">
                    Sent <time dateTime={m.receivedAt}>{sentAt(m.receivedAt)}</time>
                  </span>
                </Button>
              </li>
            ))}
          </ul>
          {open !== null && (
            <Card>
              <MailBody id={open} />
            </Card>
          )}
        </div>
      </div>
    </TeacherOnly>
  );
}
