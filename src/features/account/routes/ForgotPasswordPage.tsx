import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { ApiError } from '../../../lib/api/client';
import { useRequestReset } from '../api/password-reset';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { TextField } from '../../../components/ui/TextField';

export function ForgotPasswordPage() {
  const request = useRequestReset();
  const [email, setEmail] = useState('');
  const error = request.error instanceof ApiError ? request.error : null;
  function submit(event: FormEvent) {
    event.preventDefault();
    request.mutate(email);
  }
  return (
    <Card className="mx-auto max-w-md">
      <h1 className="mb-6 text-title font-semibold">Forgot your password?</h1>
      {request.data ? (
        <FormMessage>{request.data.message}</FormMessage>
      ) : (
        <form noValidate onSubmit={submit} className="flex flex-col gap-5">
          <p>We will e-mail you a link to choose a new one.</p>
          {error && !Object.keys(error.fields).length && <FormMessage error>{error.message}</FormMessage>}
          <TextField label="E-mail" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={error?.fields.email} />
          <Button kind="primary" type="submit" disabled={request.isPending}>
            Send me a link
          </Button>
        </form>
      )}
      <p className="mt-6">
        <Link to="/sign-in">Back to sign in</Link>
      </p>
    </Card>
  );
}
