// The two things a member changes about themselves on "Your account": the name others see, and
// the password (the current one first; every other place they are signed in is signed out).
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { accountPatchSchema, PASSWORD_MIN, passwordChangeSchema, type PublicUser } from '@shared/auth-schemas';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { useChangePassword, useRename } from '../api/account';

export function NameForm({ user }: { user: PublicUser }) {
  const rename = useRename();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(accountPatchSchema), defaultValues: { displayName: user.displayName } });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(({ displayName }) => {
    setFailure(null);
    rename.mutate(displayName, {
      onSuccess: (saved) => form.reset({ displayName: saved.displayName }),
      onError: (error) => {
        if (!applyFieldErrors(error, form.setError, ['displayName'])) setFailure(error.message);
      },
    });
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex max-w-xl flex-col gap-4">
      <FormAlert title="Your name was not changed" message={failure} />
      <TextField
        label="Your name"
        hint="Shown to the mentors and growers you talk with, and on your cases."
        autoComplete="nickname"
        error={errors.displayName?.message}
        {...form.register('displayName')}
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={rename.isPending}>
          {rename.isPending ? 'Saving…' : 'Save the name'}
        </Button>
        <p role="status" className="font-bold text-moss-deep empty:hidden">
          {rename.isSuccess && !form.formState.isDirty ? 'Saved.' : ''}
        </p>
      </div>
    </form>
  );
}

export function PasswordForm() {
  const change = useChangePassword();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(passwordChangeSchema), defaultValues: { currentPassword: '', password: '' } });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit((values) => {
    setFailure(null);
    change.mutate(values, {
      onSuccess: () => form.reset({ currentPassword: '', password: '' }),
      onError: (error) => {
        if (!applyFieldErrors(error, form.setError, ['currentPassword', 'password'])) setFailure(error.message);
      },
    });
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex max-w-xl flex-col gap-4">
      <FormAlert title="Your password was not changed" message={failure} />
      <TextField label="Current password" type="password" autoComplete="current-password" error={errors.currentPassword?.message} {...form.register('currentPassword')} />
      <TextField
        label="New password"
        type="password"
        hint={`At least ${PASSWORD_MIN} characters. A few unrelated words make a strong one.`}
        autoComplete="new-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <div className="flex flex-col items-start gap-3">
        <Button type="submit" disabled={change.isPending}>
          {change.isPending ? 'Changing…' : 'Change the password'}
        </Button>
        <p role="status" className="font-bold text-moss-deep empty:hidden">
          {change.isSuccess ? 'Your password is changed. Anywhere else you were signed in, you are signed out; here you stay signed in.' : ''}
        </p>
      </div>
    </form>
  );
}
