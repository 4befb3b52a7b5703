import { Link, useNavigate, useSearchParams } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Card } from '../../../components/ui/card';
import { SignInForm } from '../../../features/auth/components/sign-in-form';
import { HOME_BY_ROLE, redirectIfSignedIn, safeNext } from '../../../lib/auth';

export const clientLoader = redirectIfSignedIn;

export default function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const rawNext = params.get('next');
  const next = safeNext(rawNext);
  const joinPath = rawNext ? `/join?next=${encodeURIComponent(next)}` : '/join';

  return (
    <ContentLayout title="Sign in" lead={rawNext ? 'Sign in to go on to the page you asked for.' : undefined}>
      <Card className="max-w-md">
        <SignInForm onSignedIn={(user) => navigate(safeNext(rawNext, HOME_BY_ROLE[user.role]), { replace: true })} />
      </Card>
      <p className="mt-6">
        <Link to="/forgot-password">Forgot your password?</Link>
      </p>
      <p className="mt-2">
        New to Sporewell? <Link to={joinPath}>Join as a grower</Link>
      </p>
    </ContentLayout>
  );
}
