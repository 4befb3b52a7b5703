import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router';
import { z } from 'zod';
import { emailSchema } from '@shared/auth-schemas';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField, emailInputProps } from '../../../components/ui/text-field';
import { useRequestPasswordReset } from '../../../features/auth/api/password-reset';

const schema = z.object({ email: emailSchema });

export default function ForgotPasswordRoute() {
  const request = useRequestPasswordReset();
  const [sent, setSent] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(schema), defaultValues: { email: '' } });

  const onSubmit = form.handleSubmit(({ email }) =>
    request.mutate(email, { onSuccess: (res) => setSent(res.message) }),
  );

  return (
    <ContentLayout title="Forgot your password?" lead="We will e-mail you a link to choose a new one.">
      <Card className="max-w-md">
        {sent ? (
          <Alert tone="success" title="Check your e-mail">
            {sent} The link works for one hour.
          </Alert>
        ) : (
          <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
            <FormAlert title="That did not go through" message={request.error?.message ?? null} />
            <TextField label="E-mail" {...emailInputProps} error={form.formState.errors.email?.message} {...form.register('email')} />
            <Button type="submit" disabled={request.isPending} className="self-start">
              {request.isPending ? 'Sending…' : 'Send me a link'}
            </Button>
          </form>
        )}
      </Card>
      <p className="mt-6">
        <Link to="/sign-in">Back to sign in</Link>
      </p>
    </ContentLayout>
  );
}
