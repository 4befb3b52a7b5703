import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { loginSchema, type PublicUser } from '@shared/auth-schemas';
import { ApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField, emailInputProps } from '../../../components/ui/text-field';
import { useLogin } from '../api/login';

function signInFailure(error: Error): string {
  // 429 carries the server's own words on when to try again.
  if (error instanceof ApiError && error.status === 401) return 'That e-mail and password do not match.';
  return error.message;
}

export function SignInForm({ onSignedIn }: { onSignedIn: (user: PublicUser) => void }) {
  const login = useLogin();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(loginSchema), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setFailure(null);
    login.mutate(values, {
      onSuccess: onSignedIn,
      onError: (error) => {
        if (!applyFieldErrors(error, form.setError, ['email', 'password'])) setFailure(signInFailure(error));
      },
    });
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <FormAlert title="Sign-in did not go through" message={failure} />
      <TextField label="E-mail" {...emailInputProps} error={errors.email?.message} {...form.register('email')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" disabled={login.isPending} className="self-start">
        {login.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
