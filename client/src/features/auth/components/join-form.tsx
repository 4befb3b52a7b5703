import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { PASSWORD_MIN, registerSchema, type PublicUser } from '@shared/auth-schemas';
import { ApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField, emailInputProps } from '../../../components/ui/text-field';
import { useRegister } from '../api/register';

const EMAIL_TAKEN = 'There is already an account with this e-mail. Sign in instead, or use another address.';

export function JoinForm({ onJoined }: { onJoined: (user: PublicUser) => void }) {
  const join = useRegister();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm({
    resolver: zodResolver(registerSchema),
    defaultValues: { displayName: '', email: '', password: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    setFailure(null);
    join.mutate(values, {
      onSuccess: onJoined,
      onError: (error) => {
        if (error instanceof ApiError && error.status === 409) {
          form.setError('email', { type: 'server', message: EMAIL_TAKEN }, { shouldFocus: true });
        } else if (!applyFieldErrors(error, form.setError, ['displayName', 'email', 'password'])) {
          setFailure(error.message);
        }
      },
    });
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <FormAlert title="Your account was not created" message={failure} />
      <TextField
        label="Your name"
        hint="Shown to mentors and growers you talk with."
        autoComplete="nickname"
        error={errors.displayName?.message}
        {...form.register('displayName')}
      />
      <TextField label="E-mail" {...emailInputProps} error={errors.email?.message} {...form.register('email')} />
      <TextField
        label="Password"
        type="password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        autoComplete="new-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" disabled={join.isPending} className="self-start">
        {join.isPending ? 'Creating your account…' : 'Join Sporewell'}
      </Button>
    </form>
  );
}
