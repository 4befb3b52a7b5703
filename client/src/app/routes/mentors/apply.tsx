// A grower's application to mentor (PRODUCT.md: "a grower may apply to mentor, a steward approves").
import type { QueryClient } from '@tanstack/react-query';
import { Link } from 'react-router';
import { APPLICATION_STATUS_LABELS, type MentorApplication } from '@shared/steward-schemas';
import { labelOf, STAGES } from '@shared/vocabulary';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { SafetyCautions } from '../../../components/safety-cautions';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { useUser } from '../../../features/auth/api/get-me';
import { myApplicationsQueryOptions, useMyApplications } from '../../../features/mentor-applications/api/get-my-applications';
import { ApplyForm } from '../../../features/mentor-applications/components/apply-form';
import { formatDate, formatDateTime } from '../../../features/steward/lib/dates';

export const clientLoader = (queryClient: QueryClient) => async () => {
  await queryClient.ensureQueryData(myApplicationsQueryOptions()).catch(() => undefined);
  return null;
};

const LEAD = 'Mentors pick up cases on their rounds, talk growers through a batch that is going wrong, and close cases into lessons for the Field Library. A steward reads every application.';

export default function ApplyToMentorRoute() {
  const user = useUser().data;
  const mine = useMyApplications();

  if (user && user.role !== 'grower') {
    return (
      <ContentLayout title="Apply to mentor" lead={`You are already a ${user.role} on Sporewell.`}>
        <Link to="/rounds" className={buttonClasses('primary')}>
          Go to the rounds
        </Link>
      </ContentLayout>
    );
  }

  const latest = mine.data?.items[0];
  return (
    <ContentLayout title="Apply to mentor" lead={LEAD}>
      {mine.isPending && <Spinner label="Checking for an earlier application…" />}
      {mine.isError && (
        <Alert tone="danger" title="Your earlier applications could not be checked">
          {mine.error.message}
        </Alert>
      )}
      {mine.data &&
        (latest?.status === 'pending' ? (
          <PendingApplication application={latest} />
        ) : (
          <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
            <div className="flex flex-col gap-6">
              {latest?.status === 'declined' && (
                <Alert tone="info" title={`Your application of ${formatDate(latest.createdAt)} was not approved`}>
                  {latest.note ? <>The steward wrote: “{latest.note}”. </> : null}You are welcome to apply again.
                </Alert>
              )}
              <ApplyForm onApplied={() => window.scrollTo({ top: 0 })} />
            </div>
            <aside aria-label="Before you apply" className="flex flex-col gap-4">
              <p>
                As a mentor you give advice that growers act on. When a batch smells putrid or grows black, pink or slime, the advice is to discard it. For
                inputs on food crops, point growers to local codes and licensed agronomists.
              </p>
              <SafetyCautions />
            </aside>
          </div>
        ))}
    </ContentLayout>
  );
}

function PendingApplication({ application }: { application: MentorApplication }) {
  return (
    <Alert tone="success" title="Your application is with the stewards">
      <p>
        Sent {formatDateTime(application.createdAt)} — {APPLICATION_STATUS_LABELS[application.status].toLowerCase()}. You will get an e-mail with the decision;
        if it is a yes, your account becomes a mentor account straight away.
      </p>
      <p className="mt-2">Stages: {application.stages.map((s) => labelOf(STAGES, s).split(' — ')[0]).join(', ')} · {application.region}</p>
      <Link to="/batches" className="mt-3 inline-block">
        Back to your batch shelf
      </Link>
    </Alert>
  );
}
