import { lazy } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { conversationPath } from '@shared/case-links';
import type { BatchView } from '@shared/case-schemas';
import { STATUS_LABELS } from '@shared/case-status';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { AfterFirstPaint } from '../../../components/ui/after-first-paint';
import { Spinner } from '../../../components/ui/spinner';
import { batchQueryOptions } from '../../../features/batches/api/get-batch';
import { useBatches } from '../../../features/batches/api/get-batches';
import { formatMadeOn } from '../../../features/batches/lib/batch-format';
import { openCasesOf } from '../../../features/batches/lib/open-cases';
import { batchParamOf } from './open-case.loader';

// The form is a chunk of its own (with the form library, the schemas and the live check), fetched
// once the page has been painted (AfterFirstPaint): the heading and the lead, the page's largest
// text, wait only for this small file instead of for everything the form needs.
const OpenCaseForm = lazy(() => import('../../../features/cases/components/open-case-form').then((m) => ({ default: m.OpenCaseForm })));

export default function OpenCaseRoute() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const batchId = batchParamOf(params);
  const batch = useQuery({ ...batchQueryOptions(batchId ?? 0), enabled: batchId !== null });

  return (
    <ContentLayout
      title="Open a case"
      lead="Tell the mentors what your batch is doing. While you type, Sporewell checks the sugar and water and shows resolved cases like yours."
    >
      {batchId !== null && !batch.data ? (
        <Spinner label="Fetching your batch…" />
      ) : (
        <>
          {batch.data && <StillOpen batch={batch.data} />}
          {batch.data ? (
            <p className="mb-6 rounded-soft border border-line bg-rice-deep px-4 py-3">
              About your batch <Link to={`/batches/${batch.data.id}`} className="font-bold">{batch.data.label}</Link>, made{' '}
              {formatMadeOn(batch.data.madeOn)}. <Link to="/cases/new">Open a case without a batch instead</Link>
            </p>
          ) : (
            <BatchChooser onChoose={(id) => setParams({ batch: String(id) })} />
          )}
          {/* The fallback holds a screen's height, so the footer is not in view to be pushed down when the form comes (a layout shift). */}
          <AfterFirstPaint
            fallback={
              <div className="min-h-dvh">
                <Spinner label="Opening the form…" />
              </div>
            }
          >
            <OpenCaseForm key={batchId ?? 'none'} batch={batch.data ?? null} onOpened={(created) => void navigate(`/cases/${created.id}`)} />
          </AfterFirstPaint>
        </>
      )}
    </ContentLayout>
  );
}

function BatchChooser({ onChoose }: { onChoose: (id: number) => void }) {
  const batches = useBatches();
  const items = batches.data?.items ?? [];
  if (items.length === 0) return null;
  return (
    <div className="mb-6 flex flex-col gap-1 rounded-soft border border-line bg-rice-deep px-4 py-3">
      <label htmlFor="case-batch" className="font-bold">
        Is it a batch on your shelf?
      </label>
      <p id="case-batch-hint" className="text-base text-loam-soft">
        Choose it and its stage, place and weights are filled in for you.
      </p>
      <select
        id="case-batch"
        aria-describedby="case-batch-hint"
        defaultValue=""
        onChange={(event) => event.target.value && onChoose(Number(event.target.value))}
        className="min-h-12 w-full max-w-md rounded-soft border-2 border-loam-soft bg-rice px-3 text-lg"
      >
        <option value="">No, start from scratch</option>
        {items.map((b) => (
          <option key={b.id} value={b.id}>
            {b.label} ({b.stage}, made {formatMadeOn(b.madeOn, 'short')})
          </option>
        ))}
      </select>
    </div>
  );
}

/**
 * A case about this batch is still being worked on: the mentors already have its story, so new
 * signs usually belong in that thread. Opening another stays possible (something new went wrong).
 */
function StillOpen({ batch }: { batch: BatchView }) {
  const open = openCasesOf(batch);
  if (open.length === 0) return null;
  return (
    <section aria-labelledby="still-open-heading" className="mb-6 rounded-soft border-2 border-clay bg-clay-mist px-4 py-3">
      <h2 id="still-open-heading" className="font-extrabold text-clay-deep">
        {open.length === 1 ? 'This batch already has a case open' : `This batch already has ${open.length} cases open`}
      </h2>
      <ul className="mt-1 flex flex-col gap-1">
        {open.map((c) => (
          <li key={c.id}>
            {/* Straight to its conversation, where the new signs are to be told. */}
            <Link to={conversationPath(c.id)} className="font-bold">
              {c.title}
            </Link>{' '}
            <span className="text-loam-soft">({STATUS_LABELS[c.status].toLowerCase()})</span>
          </li>
        ))}
      </ul>
      <p className="mt-2 text-base">
        New signs are best told there, where the mentor has the whole story. Open another case below only if something else has gone wrong.
      </p>
    </section>
  );
}
