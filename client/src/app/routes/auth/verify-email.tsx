import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { useUser } from '../../../features/auth/api/get-me';
import { useVerifyEmail } from '../../../features/auth/api/verify-email';
import { ConfirmEmailNotice } from '../../../features/auth/components/confirm-email-notice';

export default function VerifyEmailRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const verify = useVerifyEmail();
  const me = useUser().data;
  const asked = useRef(false);

  useEffect(() => {
    // Tokens are single-use: ask once, even under React's double effects in development.
    if (token && !asked.current) {
      asked.current = true;
      verify.mutate(token);
    }
  }, [token, verify]);

  return (
    <ContentLayout title="Confirm your e-mail">
      {!token && (
        <>
          <Alert tone="warning" title="This link is not complete">
            Open the link from the e-mail again.
          </Alert>
          <ConfirmEmailNotice className="mt-4" afterFailedLink />
        </>
      )}
      {verify.isPending && <Spinner label="Checking the link…" />}
      {verify.isSuccess && (
        <Alert tone="success" title="Thank you — your e-mail is confirmed">
          Go to your <Link to="/batches">batch shelf</Link>.
        </Alert>
      )}
      {verify.isError && (
        <>
          <Alert tone="danger" title="That link did not work">
            {verify.error.message}
          </Alert>
          {me === null && (
            <p className="mt-4">
              <Link to="/sign-in?next=/batches">Sign in</Link>, and your batch shelf offers to send a new link.
            </p>
          )}
          {me?.emailVerified && (
            <p className="mt-4">
              Your address {me.email} is confirmed already, so there is nothing more to do. Go to your <Link to="/batches">batch shelf</Link>.
            </p>
          )}
          <ConfirmEmailNotice className="mt-4" afterFailedLink />
        </>
      )}
    </ContentLayout>
  );
}
