import { Link, useNavigate, useSearchParams } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Card } from '../../../components/ui/card';
import { JoinForm } from '../../../features/auth/components/join-form';
import { redirectIfSignedIn, safeNext, signInPath } from '../../../lib/auth';

export const clientLoader = redirectIfSignedIn;

export default function JoinRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const rawNext = params.get('next');
  const next = safeNext(rawNext);

  return (
    <ContentLayout
      title="Join Sporewell"
      lead="Every account starts as a grower. Once you have joined, you can apply to become a mentor."
    >
      <Card className="max-w-md">
        <JoinForm onJoined={() => navigate(next, { replace: true })} />
      </Card>
      <p className="mt-6">
        Already have an account? <Link to={signInPath(rawNext ? next : undefined)}>Sign in</Link>
      </p>
    </ContentLayout>
  );
}
