import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ApiError } from '../../../lib/api/client';
import { useConfirmReset, useResetLink } from '../api/password-reset';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { TextField } from '../../../components/ui/TextField';

export function ResetPasswordPage() {
  const token = useParams().token!;
  const link = useResetLink(token);
  const confirm = useConfirmReset();
  const [password, setPassword] = useState('');
  const error = confirm.error instanceof ApiError ? confirm.error : null;
  function submit(event: FormEvent) {
    event.preventDefault();
    confirm.mutate({ token, password });
  }
  return (
    <Card className="mx-auto max-w-md">
      <h1 className="mb-6 text-title font-semibold">Choose a new password</h1>
      {link.isPending && <p role="status">Checking the link…</p>}
      {link.error && (
        <>
          <FormMessage error>{link.error.message}</FormMessage>
          <p className="mt-4">
            <Link to="/forgot-password">Ask for a new link</Link>
          </p>
        </>
      )}
      {confirm.data ? (
        <>
          <FormMessage>{confirm.data.message}</FormMessage>
          <p className="mt-4">
            <Link to="/sign-in">Sign in</Link>
          </p>
        </>
      ) : (
        link.data && (
          <form noValidate onSubmit={submit} className="flex flex-col gap-5">
            {error && !Object.keys(error.fields).length && <FormMessage error>{error.message}</FormMessage>}
            <TextField
              label="New password"
              type="password"
              autoComplete="new-password"
              hint="At least 8 characters."
              value={password}
              onChange={(e) => setPassword(e.target.value)}
              error={error?.fields.password}
            />
            <Button kind="primary" type="submit" disabled={confirm.isPending}>
              Save my new password
            </Button>
          </form>
        )
      )}
    </Card>
  );
}
