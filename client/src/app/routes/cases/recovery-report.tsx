// The recovery report (PRODUCT.md screen 7), reachable straight from the closing and check-in
// e-mails: the grower says how the batch did, rates the advice and chooses whether to share it.
import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { OUTCOME_LABELS } from '@shared/closing-schemas';
import { CAUSES, REMEDIES, labelOf } from '@shared/vocabulary';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { useUser } from '../../../features/auth/api/get-me';
import { routeIdOf } from '../../../features/batches/lib/route-id';
import { closingQueryOptions } from '../../../features/closing/api/get-closing';
import { RecoveryReportForm } from '../../../features/closing/components/recovery-report-form';

export const clientLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  await queryClient.ensureQueryData(closingQueryOptions(routeIdOf(params.id)));
  return null;
};

export default function RecoveryReportRoute() {
  const caseId = routeIdOf(useParams().id);
  const { data: state } = useSuspenseQuery(closingQueryOptions(caseId));
  const user = useUser().data ?? null;
  // Whether this visit began with the form: then a report that is in now was just filed here.
  const [cameToFile] = useState(() => state.outcome === null);
  const back = (
    <Link to={`/cases/${caseId}`} className={buttonClasses('secondary')}>
      Back to the case
    </Link>
  );

  if (state.outcome) {
    return (
      <ContentLayout title={cameToFile ? 'Thank you, the report is in' : 'The recovery report is in'} lead={`For “${state.title}”.`}>
        <div className="flex max-w-prose flex-col gap-4">
          {state.outcome && (
            <p className="text-lg">
              {OUTCOME_LABELS[state.outcome]}
              {state.stars && <>, and the advice rated {state.stars} of 5</>}.
            </p>
          )}
          {cameToFile && state.outcome === 'lost' && (
            <p>
              Sorry the batch was lost. What you told us goes into the record of that remedy, so the next grower with a batch like it
              is steered towards what works.
            </p>
          )}
          {state.published && state.noteSlug ? (
            <Alert tone="success" title="Shared in the Field Library">
              Other growers can now learn from your batch. <Link to={`/library/${state.noteSlug}`}>Read the field note</Link>. You can stop sharing
              it from the case page at any time.
            </Alert>
          ) : (
            <p className="text-loam-soft">It is not shared in the Field Library. You can change that from the case page.</p>
          )}
          <div className="flex flex-wrap gap-3">{back}</div>
        </div>
      </ContentLayout>
    );
  }

  if (user && user.id !== state.grower.id) {
    return (
      <ContentLayout title="This report is for the grower" lead="Only the grower who opened this case can say how the batch did.">
        {back}
      </ContentLayout>
    );
  }

  if (state.status === 'lost' || state.status === 'withdrawn') {
    return (
      <ContentLayout title="This case has ended" lead="It was closed without a recovery report, so there is nothing left to file.">
        {back}
      </ContentLayout>
    );
  }

  if (!state.can.fileReport) {
    return (
      <ContentLayout title="This case is not closed yet" lead="The recovery report comes after a mentor closes the case with a remedy to try.">
        {back}
      </ContentLayout>
    );
  }

  return (
    <ContentLayout title="How did the batch do?" lead={`For “${state.title}”. It takes a minute, and it is how the next grower learns what works.`}>
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <RecoveryReportForm state={state} />
        <aside aria-labelledby="advice-heading" className="order-first flex flex-col gap-2 self-start rounded-soft border border-line bg-rice-deep p-4 lg:order-none">
          <h2 id="advice-heading" className="text-lg font-extrabold">
            What {state.closedBy?.displayName ?? 'the mentor'} suggested
          </h2>
          {state.cause && (
            <p>
              <span className="font-bold">Likely cause: </span>
              {labelOf(CAUSES, state.cause)}
            </p>
          )}
          {state.remedy && (
            <p>
              <span className="font-bold">Remedy: </span>
              {labelOf(REMEDIES, state.remedy)}
              {state.remedyNotes && <span className="block text-loam-soft">{state.remedyNotes}</span>}
            </p>
          )}
          {state.summary && <p className="whitespace-pre-line text-loam-soft">{state.summary}</p>}
        </aside>
      </div>
    </ContentLayout>
  );
}
