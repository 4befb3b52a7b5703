import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useSearchParams } from 'react-router';
import { z } from 'zod';
import { PASSWORD_MIN, passwordSchema } from '@shared/auth-schemas';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { useResetPassword } from '../../../features/auth/api/password-reset';
import { applyFieldErrors } from '../../../lib/form-errors';

const schema = z.object({ password: passwordSchema });

export default function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const reset = useResetPassword();
  const form = useForm({ resolver: zodResolver(schema), defaultValues: { password: '' } });

  const onSubmit = form.handleSubmit(({ password }) =>
    reset.mutate({ token, password }, { onError: (error) => applyFieldErrors(error, form.setError, ['password']) }),
  );

  if (!token) {
    return (
      <ContentLayout title="Choose a new password">
        <Alert tone="warning" title="This link is not complete">
          Open the link from the e-mail again, or <Link to="/forgot-password">ask for a new one</Link>.
        </Alert>
      </ContentLayout>
    );
  }

  return (
    <ContentLayout title="Choose a new password">
      <Card className="max-w-md">
        {reset.isSuccess ? (
          <Alert tone="success" title="Your password is changed">
            Every device that was signed in has been signed out. <Link to="/sign-in">Sign in</Link> with the new password.
          </Alert>
        ) : (
          <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
            <FormAlert title="The password was not changed" message={reset.error && !('fields' in reset.error && reset.error.fields) ? reset.error.message : null} />
            <TextField
              label="New password"
              type="password"
              autoComplete="new-password"
              hint={`At least ${PASSWORD_MIN} characters. A few unrelated words work well.`}
              error={form.formState.errors.password?.message}
              {...form.register('password')}
            />
            <Button type="submit" disabled={reset.isPending} className="self-start">
              {reset.isPending ? 'Saving…' : 'Save the new password'}
            </Button>
          </form>
        )}
      </Card>
    </ContentLayout>
  );
}
