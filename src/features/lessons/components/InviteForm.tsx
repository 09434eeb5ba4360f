import { useRef, useState, type FormEvent } from 'react';
import { ApiError } from '../../../lib/api/client';
import { useInvite, type InviteResult } from '../api/lessons';
import { Button } from '../../../components/ui/Button';
import { FormMessage } from '../../../components/ui/FormMessage';

/** Invite by e-mail: one address a line (or separated by commas). */
export function InviteForm({ lessonId }: { lessonId: string }) {
  const invite = useInvite(lessonId);
  const [text, setText] = useState('');
  const [results, setResults] = useState<InviteResult[]>([]);
  const error = invite.error instanceof ApiError ? invite.error : null;
  // One message per wrong address ("ruth@harborlane is not an e-mail address"), in the order typed.
  const fieldErrors = error ? Object.entries(error.fields).sort(([a], [b]) => a.localeCompare(b, 'en', { numeric: true })).map(([, message]) => message) : [];
  const fieldError = fieldErrors.length > 0;

  // isPending disables the button only from the next render on: a second click before that must not send again.
  const sending = useRef(false);

  function submit(event: FormEvent) {
    event.preventDefault();
    if (sending.current) return;
    sending.current = true;
    const emails = text.split(/[\s,;]+/).filter(Boolean);
    invite.mutate(emails, {
      onSuccess: ({ results: r }) => {
        setResults(r);
        if (r.every((x) => x.status !== 'failed')) setText('');
      },
      onSettled: () => {
        sending.current = false;
      },
    });
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-3" aria-labelledby="invite-title">
      <h2 id="invite-title" className="text-lead font-semibold">
        Invite students
      </h2>
      <label htmlFor="invite-emails" className="font-medium">
        E-mail addresses
      </label>
      <p id="invite-hint" className="text-base text-ink-soft">
        One a line, or separated by commas. Each gets a link that works once.
      </p>
      <textarea
        id="invite-emails"
        rows={3}
        value={text}
        onChange={(e) => setText(e.target.value)}
        aria-describedby={fieldError ? 'invite-hint invite-error' : 'invite-hint'}
        aria-invalid={fieldError ? true : undefined}
        className={`rounded-lg border-2 bg-card px-3 py-2 text-body ${fieldError ? 'border-danger' : 'border-line'}`}
      />
      {fieldErrors.length === 1 && (
        <p id="invite-error" className="font-medium text-danger">
          <span aria-hidden="true">✕ </span>
          {fieldErrors[0]}
        </p>
      )}
      {fieldErrors.length > 1 && (
        <ul id="invite-error" className="font-medium text-danger">
          {fieldErrors.map((message) => (
            <li key={message}>
              <span aria-hidden="true">✕ </span>
              {message}
            </li>
          ))}
        </ul>
      )}
      {error && !fieldError && <FormMessage error>{error.message}</FormMessage>}
      {results.length > 0 && (
        <FormMessage error={results.some((r) => r.status === 'failed')}>
          <ul>
            {results.map((r) => (
              <li key={r.email}>{r.message}</li>
            ))}
          </ul>
        </FormMessage>
      )}
      <Button kind="primary" type="submit" disabled={invite.isPending} className="self-start">
        {invite.isPending ? 'Sending…' : 'Send invitations'}
      </Button>
    </form>
  );
}
