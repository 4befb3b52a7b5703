import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { useVerifyEmail } from '../../../features/auth/api/verify-email';

export default function VerifyEmailRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const verify = useVerifyEmail();
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
      {!token && <Alert tone="warning" title="This link is not complete">Open the link from the e-mail again.</Alert>}
      {verify.isPending && <Spinner label="Checking the link…" />}
      {verify.isSuccess && (
        <Alert tone="success" title="Thank you — your e-mail is confirmed">
          Go to your <Link to="/batches">batch shelf</Link>.
        </Alert>
      )}
      {verify.isError && (
        <Alert tone="danger" title="That link did not work">
          {verify.error.message}
        </Alert>
      )}
    </ContentLayout>
  );
}
