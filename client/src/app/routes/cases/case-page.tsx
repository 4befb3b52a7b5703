import { lazy } from 'react';
import { useSuspenseQuery } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { PAGE_WIDTH } from '../../../components/layouts/content-layout';
import { cx } from '../../../components/ui/cx';
import { useUser } from '../../../features/auth/api/get-me';
import { routeIdOf } from '../../../features/batches/lib/route-id';
import { caseQueryOptions } from '../../../features/cases/api/get-case';
import { useSimilarToCase } from '../../../features/cases/api/get-similar-cases';
import { AddCasePhotos } from '../../../features/cases/components/add-case-photos';
import { CaseHeader } from '../../../features/cases/components/case-header';
import { CasePhotos } from '../../../features/cases/components/case-photos';
import { SimilarCasesList } from '../../../features/cases/components/similar-cases-list';
import { AfterFirstPaint } from '../../../components/ui/after-first-paint';
import { Spinner } from '../../../components/ui/spinner';
import { RecoveryPrompt } from '../../../features/closing/components/recovery-prompt';

// Below the case itself, so fetched once the case has been painted (AfterFirstPaint): the thread
// (with its composer and the live connection's handling) and the closing panel (with its form
// library). The page's largest text, the case, no longer waits for their code.
const CloseCasePanel = lazy(() => import('../../../features/closing/components/close-case-panel').then((m) => ({ default: m.CloseCasePanel })));
const CaseThread = lazy(() => import('../../../features/threads/components/case-thread').then((m) => ({ default: m.CaseThread })));

export default function CasePageRoute() {
  const id = routeIdOf(useParams().id);
  const { data: detail } = useSuspenseQuery(caseQueryOptions(id));
  const user = useUser().data ?? null;
  const similar = useSimilarToCase(id);
  // The grower of the case and mentors may add photos (the server checks this too).
  const mayAddPhotos = user !== null && (user.id === detail.grower.id || user.role === 'mentor');

  return (
    <div className={cx(PAGE_WIDTH, 'flex flex-col gap-10 py-8 sm:py-10')}>
      <CaseHeader detail={detail} viewerId={user?.id ?? null} />
      <RecoveryPrompt caseId={id} />

      <section aria-labelledby="case-photos-heading" className="flex flex-col gap-4">
        <h2 id="case-photos-heading" className="text-xl font-extrabold">
          Photos
        </h2>
        <CasePhotos photos={detail.photos} title={detail.title} />
        {mayAddPhotos && <AddCasePhotos caseId={id} by={user.id === detail.grower.id ? 'grower' : 'mentor'} />}
      </section>

      <SimilarCasesList
        items={similar.data?.items}
        state={similar.isPending ? 'loading' : similar.isError ? 'error' : 'ready'}
        error={similar.error?.message}
        emptyText=""
      />

      <AfterFirstPaint fallback={<Spinner label="Opening the thread…" />}>
        <CloseCasePanel caseId={id} />
        <CaseThread caseId={id} />
      </AfterFirstPaint>
    </div>
  );
}
