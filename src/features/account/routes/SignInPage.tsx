import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useSignIn } from '../../../lib/api/auth';
import { ApiError } from '../../../lib/api/client';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { TextField } from '../../../components/ui/TextField';
import { safeReturnPath } from '../../../lib/return-path';

export function SignInPage() {
  const signIn = useSignIn();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  // Where the person was before: `?next=/tables/abc`, a path on this site only.
  const next = safeReturnPath(params.get('next'));
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const error = signIn.error instanceof ApiError ? signIn.error : null;

  function submit(event: FormEvent) {
    event.preventDefault();
    signIn.mutate({ email, password }, { onSuccess: () => navigate(next, { replace: true }) });
  }

  return (
    <Card className="mx-auto max-w-md">
      <h1 className="mb-6 text-title font-semibold">Sign in</h1>
      {next !== '/' && <p className="mb-4 text-ink-soft">After signing in you go back to the page you were on.</p>}
      <form onSubmit={submit} noValidate className="flex flex-col gap-5">
        <FormMessage error>{error && !Object.keys(error.fields).length ? error.message : null}</FormMessage>
        <TextField label="E-mail" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={error?.fields.email} required />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          error={error?.fields.password}
          required
        />
        <Button kind="primary" type="submit" disabled={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
      </form>
      <p className="mt-6">
        <Link to="/forgot-password">Forgot your password?</Link>
      </p>
      <p className="mt-2">
        New to Rackside? <Link to="/register">Make an account</Link>
      </p>
    </Card>
  );
}
