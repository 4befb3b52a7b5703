import { Link } from 'react-router';
import { SUGAR_TYPES } from '@shared/batch-check-model';
import { STATUS_LABELS } from '@shared/case-status';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { buttonClasses } from '../../../components/ui/button';
import { BatchCheckPanel } from '../../../features/batch-check/components/batch-check-panel';
import { liveBatchCheck } from '../../../features/batch-check/hooks/use-live-batch-check';
import { batchRouteLoader, useRouteBatch } from '../../../features/batches/api/get-batch';
import { ageText, formatMadeOn, stageLabel } from '../../../features/batches/lib/batch-format';
import { openCasesOf } from '../../../features/batches/lib/open-cases';
import { OffShelfControl } from '../../../features/batches/components/off-shelf-control';
import { dayShortMonth } from '../../../lib/english-dates';

export const clientLoader = batchRouteLoader;

export default function BatchPageRoute() {
  const batch = useRouteBatch();
  const check = liveBatchCheck({
    stage: batch.stage,
    culture: batch.culture,
    // A batch still being gathered (IMO1) has no sugar, which is what the check expects.
    sugar: batch.sugar ?? (batch.stage === 'IMO1' ? { value: 0, unit: batch.culture?.unit ?? 'g' } : null),
    sugarType: batch.sugarType,
    moisturePct: batch.moisturePct,
  });
  const details: Array<[string, string]> = [
    ['Stage', stageLabel(batch.stage)],
    ['Made on', `${formatMadeOn(batch.madeOn)} (${ageText(batch.ageDays)}${batch.ageDays > 0 ? ' old' : ''})`],
    ['Culture', batch.culture ? `${batch.culture.value} ${batch.culture.unit}` : 'not recorded'],
    [
      'Sugar',
      batch.sugar
        ? `${batch.sugar.value} ${batch.sugar.unit}${batch.sugarType ? ` of ${SUGAR_TYPES[batch.sugarType].label}` : ''}`
        : 'not recorded',
    ],
    ['Moisture', batch.moisturePct === null ? 'the usual value for the stage' : `${batch.moisturePct} %`],
    ['Ingredients', batch.ingredients || '—'],
    ['Container', batch.container || '—'],
    ['Cover', batch.cover || '—'],
    ['Where it sits', batch.location || '—'],
    ['Notes', batch.notes || '—'],
  ];

  return (
    <ContentLayout
      title={batch.label}
      lead={`${stageLabel(batch.stage)} · made ${formatMadeOn(batch.madeOn)}${batch.finishedOn ? ` · off the shelf since ${formatMadeOn(batch.finishedOn)}` : ''}`}
    >
      <div className="flex flex-wrap gap-3">
        <Link to={`/cases/new?batch=${batch.id}`} className={buttonClasses('primary')}>
          {openCasesOf(batch).length > 0 ? 'Open another case about this batch' : 'Open a case about this batch'}
        </Link>
        <Link to={`/batches/${batch.id}/label`} className={buttonClasses('secondary')}>
          Print a jar label
        </Link>
        <Link to={`/batches/${batch.id}/edit`} className={buttonClasses('secondary')}>
          Edit the batch
        </Link>
      </div>

      <div className="mt-8 grid gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] lg:items-start">
        <div className="flex flex-col gap-8">
          <section aria-labelledby="batch-details-heading">
            <h2 id="batch-details-heading" className="text-xl font-extrabold">
              What is in it
            </h2>
            <dl className="mt-3 grid gap-x-6 gap-y-2 sm:grid-cols-[10rem_1fr]">
              {details.map(([term, value]) => (
                <div key={term} className="contents">
                  <dt className="font-bold text-loam-soft">{term}</dt>
                  <dd className="mb-2 whitespace-pre-line sm:mb-0">{value}</dd>
                </div>
              ))}
            </dl>
          </section>

          <section aria-labelledby="batch-cases-heading">
            <h2 id="batch-cases-heading" className="text-xl font-extrabold">
              Cases about this batch
            </h2>
            {batch.cases && batch.cases.length > 0 ? (
              <ul className="mt-3 flex flex-col gap-2">
                {batch.cases.map((c) => (
                  <li key={c.id}>
                    <Link to={`/cases/${c.id}`} className="font-bold">
                      {c.title}
                    </Link>{' '}
                    <span className="text-loam-soft">
                      · {STATUS_LABELS[c.status]} · opened {dayShortMonth(new Date(c.openedAt))}
                    </span>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="mt-2 text-loam-soft">
                {batch.finishedOn ? 'None.' : 'None yet. If it starts to smell, bubble or change colour, open a case while it can still be saved.'}
              </p>
            )}
          </section>
          <OffShelfControl batch={batch} />
        </div>
        <BatchCheckPanel
          check={check}
          incompleteHint={
            <>
              This batch has no {batch.culture ? 'sugar weight' : 'culture weight'} recorded.{' '}
              <Link to={`/batches/${batch.id}/edit`}>Add its weights</Link> to see the check.
            </>
          }
        />
      </div>
    </ContentLayout>
  );
}
