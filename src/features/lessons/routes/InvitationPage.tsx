import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useMe, useRegister, useSignIn } from '../../../lib/api/auth';
import { ApiError } from '../../../lib/api/client';
import { useAcceptInvitation, useInvitation } from '../api/lessons';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { lessonPrice } from '../components/LessonList';
import { lessonTimes } from '../lesson-time';
import { TextField } from '../../../components/ui/TextField';

/** Sign in or make an account without leaving the invitation. */
function SignInHere() {
  const [mode, setMode] = useState<'sign-in' | 'register'>('sign-in');
  const signIn = useSignIn();
  const register = useRegister();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [displayName, setDisplayName] = useState('');
  const active = mode === 'sign-in' ? signIn : register;
  const error = active.error instanceof ApiError ? active.error : null;

  function submit(event: FormEvent) {
    event.preventDefault();
    if (mode === 'sign-in') signIn.mutate({ email, password });
    else register.mutate({ email, password, displayName });
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4">
      <h2 className="text-lead font-semibold">{mode === 'sign-in' ? 'Sign in to accept' : 'Make an account to accept'}</h2>
      {error && !Object.keys(error.fields).length && <FormMessage error>{error.message}</FormMessage>}
      {mode === 'register' && <TextField label="Name at the table" value={displayName} onChange={(e) => setDisplayName(e.target.value)} error={error?.fields.displayName} />}
      <TextField label="E-mail" type="email" autoComplete="email" hint="Use the address the invitation was sent to." value={email} onChange={(e) => setEmail(e.target.value)} error={error?.fields.email} />
      <TextField
        label="Password"
        type="password"
        autoComplete={mode === 'sign-in' ? 'current-password' : 'new-password'}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={error?.fields.password}
      />
      <Button kind="primary" type="submit" disabled={active.isPending}>
        {mode === 'sign-in' ? 'Sign in' : 'Make my account'}
      </Button>
      <Button kind="quiet" onClick={() => setMode(mode === 'sign-in' ? 'register' : 'sign-in')}>
        {mode === 'sign-in' ? 'New to Rackside? Make an account' : 'I already have an account'}
      </Button>
    </form>
  );
}

/** What happened to a link, in a heading; the server's message below it says what to do. */
const REFUSAL_TITLES: Record<string, string> = {
  INVITATION_REPLACED: 'This invitation was replaced',
  INVITATION_EXPIRED: 'This invitation has expired',
  INVITATION_USED: 'This invitation was already used',
  INVITATION_INVALID: 'This invitation link does not work',
};

export function InvitationPage() {
  const token = useParams().token!;
  const navigate = useNavigate();
  const { data: me, isPending } = useMe();
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation(token);
  if (isPending || invitation.isPending) return <p role="status">Loading…</p>;
  if (invitation.error) {
    const code = invitation.error instanceof ApiError ? invitation.error.code : '';
    return (
      <Card className="mx-auto max-w-xl">
        <h1 className="mb-4 text-title font-semibold">{REFUSAL_TITLES[code] ?? 'This invitation cannot be used'}</h1>
        <FormMessage error>{invitation.error.message}</FormMessage>
        {me && (
          <p className="mt-4">
            <Link to="/lessons">See my lessons</Link>
          </p>
        )}
      </Card>
    );
  }
  const { lesson, emailHint } = invitation.data;
  const { there, here } = lessonTimes(lesson.startsAt, lesson.timeZone);
  const acceptError = accept.error instanceof ApiError ? accept.error.message : accept.error ? 'The invitation could not be accepted.' : null;
  return (
    <Card className="mx-auto max-w-xl">
      <h1 className="mb-2 text-title font-semibold">You are invited to “{lesson.title}”</h1>
      <p className="text-lead">{there}</p>
      {here && <p className="text-ink-soft">{here}</p>}
      <p className="mb-4">
        {lesson.durationMinutes} minutes with {lesson.teacherName} · {lessonPrice(lesson)}. Sent to {emailHint}.
      </p>
      {me ? (
        <div className="flex flex-col gap-3">
          {acceptError && <FormMessage error>{acceptError}</FormMessage>}
          <Button
            kind="primary"
            disabled={accept.isPending}
            onClick={() => accept.mutate(undefined, { onSuccess: ({ lesson: l }) => navigate(`/lessons/${l.id}`) })}
          >
            {lesson.priceCents ? 'Accept, then pay for my seat' : 'Accept and take my seat'}
          </Button>
        </div>
      ) : (
        <SignInHere />
      )}
    </Card>
  );
}
