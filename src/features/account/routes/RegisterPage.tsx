import { useRef, useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { LIMITS } from '../../../../shared/protocol';
import { useRegister } from '../../../lib/api/auth';
import { ApiError } from '../../../lib/api/client';
import { Button } from '../../../components/ui/Button';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { TextField } from '../../../components/ui/TextField';

export function RegisterPage() {
  const register = useRegister();
  const navigate = useNavigate();
  const [form, setForm] = useState({ displayName: '', email: '', password: '' });
  const error = register.error instanceof ApiError ? register.error : null;
  const set = (key: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) => setForm({ ...form, [key]: e.target.value });

  // isPending disables the button only from the next render on: a second click before that must not send again.
  const sending = useRef(false);

  function submit(event: FormEvent) {
    event.preventDefault();
    if (sending.current) return;
    sending.current = true;
    register.mutate(form, {
      onSuccess: () => navigate('/'),
      onSettled: () => {
        sending.current = false;
      },
    });
  }

  return (
    <Card className="mx-auto max-w-md">
      <h1 className="mb-6 text-title font-semibold">Make an account</h1>
      <form onSubmit={submit} noValidate className="flex flex-col gap-5">
        <FormMessage error>{error ? (Object.keys(error.fields).length ? 'Please fix the fields marked below.' : error.message) : null}</FormMessage>
        <TextField label="Name at the table" autoComplete="name" value={form.displayName} onChange={set('displayName')} error={error?.fields.displayName} />
        <TextField label="E-mail" type="email" autoComplete="email" value={form.email} onChange={set('email')} error={error?.fields.email} />
        <TextField
          label="Password"
          type="password"
          autoComplete="new-password"
          hint={`At least ${LIMITS.passwordMin} characters.`}
          value={form.password}
          onChange={set('password')}
          error={error?.fields.password}
        />
        <Button kind="primary" type="submit" disabled={register.isPending}>
          {register.isPending ? 'Making your account…' : 'Make my account'}
        </Button>
      </form>
      <p className="mt-6">
        Have an account already? <Link to="/sign-in">Sign in</Link>
      </p>
    </Card>
  );
}
