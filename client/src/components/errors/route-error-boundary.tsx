import { Link, isRouteErrorResponse, useLocation, useRouteError } from 'react-router';
import type { Role } from '@shared/case-status';
import { ApiError } from '../../lib/api-client';
import { isRoleRefusal } from '../../lib/auth';
import { ContentLayout } from '../layouts/content-layout';
import { SporewellMark } from '../layouts/sporewell-mark';
import { NotFoundPage } from './not-found-page';
import { Button, buttonClasses } from '../ui/button';

const ROLE_PLURALS: Record<Role, string> = { grower: 'growers', mentor: 'mentors', steward: 'stewards' };
const ROLE_SINGULARS: Record<Role, string> = { grower: 'a grower', mentor: 'a mentor', steward: 'a steward' };

function statusOf(error: unknown): number | undefined {
  if (isRouteErrorResponse(error)) return error.status;
  if (error instanceof ApiError) return error.status;
  return undefined;
}

function BackToStart() {
  return (
    <Link to="/" className={buttonClasses('primary')}>
      Back to the start
    </Link>
  );
}

/** What a person sees when a page cannot be shown: plain words and a way back. */
export function RouteErrorBoundary() {
  const error = useRouteError();
  const status = statusOf(error);
  const { pathname } = useLocation();

  if (isRouteErrorResponse(error) && isRoleRefusal(error.data)) {
    const allowed = error.data.allowed.map((role) => ROLE_PLURALS[role]).join(' and ');
    return (
      <ContentLayout
        title="This page is not for your role"
        lead={`It is for ${allowed}. You are signed in as ${ROLE_SINGULARS[error.data.role]}.`}
      >
        <BackToStart />
      </ContentLayout>
    );
  }

  if (status === 404) return <NotFoundPage libraryPage={pathname.startsWith('/library/')} />;

  if (status === 403) {
    return (
      <ContentLayout title="You do not have access to this" lead="If you think you should, ask a steward of your community.">
        <BackToStart />
      </ContentLayout>
    );
  }

  const unreachable = error instanceof ApiError && error.status === 0;
  return (
    <ContentLayout
      title={unreachable ? 'Sporewell cannot be reached' : 'Something went wrong on this page'}
      lead={
        unreachable
          ? 'Check your connection, then try again.'
          : 'Try again in a moment. If it keeps happening, tell a steward what you were doing.'
      }
    >
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => window.location.reload()}>Try again</Button>
        <Link to="/" className={buttonClasses('secondary')}>
          Back to the start
        </Link>
      </div>
      {import.meta.env.DEV && error instanceof Error && (
        <pre className="mt-6 overflow-auto rounded-soft bg-rice-deep p-4 text-sm">{error.stack ?? error.message}</pre>
      )}
    </ContentLayout>
  );
}

/** For failures in the app frame itself, where the header cannot be drawn. */
export function RootErrorBoundary() {
  return (
    <div className="min-h-dvh">
      <div className="mx-auto flex max-w-5xl items-center gap-2 px-4 pt-6 text-2xl font-extrabold sm:px-6">
        <SporewellMark className="size-9" />
        Sporewell
      </div>
      <main id="main">
        <RouteErrorBoundary />
      </main>
    </div>
  );
}
