import { Link } from 'react-router';
import type { CaseDetail } from '@shared/case-schemas';
import { OPEN_STATUSES, STATUS_LABELS, type CaseStatus } from '@shared/case-status';
import { SUGAR_TYPES } from '@shared/batch-check-model';
import { formatMass } from '@shared/units';
import type { UrgencyLevel } from '@shared/urgency';
import { STAGES, SYMPTOMS, labelOf } from '@shared/vocabulary';
import { cx } from '../../../components/ui/cx';
import { dayMonthTime } from '../../../lib/english-dates';
import { RiskBadge } from '../../batch-check/components/risk-badge';
import { ratioText } from '../../batch-check/components/ratio-text';
import { WaterActivityScale } from '../../batch-check/components/water-activity-scale';
import { ageText, formatMadeOn } from '../../batches/lib/batch-format';
import { CONVERSATION_ANCHOR } from '@shared/case-links';

const STATUS_TONES: Record<CaseStatus, string> = {
  awaiting_mentor: 'border-clay bg-clay-mist text-clay-deep',
  in_conversation: 'border-moss bg-moss-mist text-moss-deep',
  over_to_grower: 'border-moss bg-moss-mist text-moss-deep',
  watching: 'border-loam-soft bg-rice text-loam',
  recovered: 'border-moss-deep bg-moss-deep text-rice',
  lost: 'border-ember bg-ember-mist text-ember',
  withdrawn: 'border-loam-soft bg-rice text-loam-soft',
};

const URGENCY_LABELS: Record<UrgencyLevel, string> = { high: 'High urgency', medium: 'Medium urgency', low: 'Low urgency' };
const URGENCY_TONES: Record<UrgencyLevel, string> = {
  high: 'border-ember bg-ember text-rice',
  medium: 'border-clay bg-clay-mist text-clay-deep',
  low: 'border-line bg-rice text-loam',
};


/** The top of a case: what it is about, where it stands and how urgent it is. */
export function CaseHeader({ detail, viewerId }: { detail: CaseDetail; viewerId: number | null }) {
  // Only the batch's owner can open its page; the case's other readers see its name.
  const ownsBatch = viewerId === detail.grower.id;
  const numbers = detail.numbers;
  const check = detail.check;
  const madeOn = detail.batch?.madeOn ?? detail.batchMadeOn;
  return (
    <header className="flex flex-col gap-5">
      <div className="flex flex-col gap-3">
        <title>{`${detail.title} · Sporewell`}</title>
        <h1 className="text-3xl font-extrabold tracking-tight text-balance sm:text-4xl">{detail.title}</h1>
        <div className="flex flex-wrap items-center gap-2">
          <span className={cx('rounded-full border-2 px-3 py-0.5 font-extrabold', STATUS_TONES[detail.status])}>
            <span className="sr-only">Status: </span>
            {STATUS_LABELS[detail.status]}
          </span>
          {/* Urgency orders the rounds; once the case is closed nobody is waiting on it. */}
          {OPEN_STATUSES.includes(detail.status) && (
            <span
              className={cx('rounded-full border-2 px-3 py-0.5 font-extrabold', URGENCY_TONES[detail.urgencyLevel])}
              title={`Urgency score ${detail.urgency} of 100`}
            >
              {URGENCY_LABELS[detail.urgencyLevel]} <span className="font-semibold">({detail.urgency})</span>
            </span>
          )}
          <span className="rounded-full border-2 border-line bg-rice-deep px-3 py-0.5 font-bold">{labelOf(STAGES, detail.stage)}</span>
        </div>
        <p className="text-loam-soft">
          Opened {dayMonthTime(new Date(detail.openedAt))} by {detail.grower.displayName}
          {detail.mentor ? <> · with <Link to={`/mentors/${detail.mentor.id}`}>{detail.mentor.displayName}</Link></> : <> · waiting for a mentor</>}
        </p>
        {viewerId !== null && (
          <Link to={`#${CONVERSATION_ANCHOR}`} className="inline-flex min-h-11 items-center gap-1 self-start font-bold">
            Go to the conversation <span aria-hidden="true" className="inline-block">↓</span>
          </Link>
        )}
      </div>

      <div className="grid gap-5 md:grid-cols-2">
        <section aria-labelledby="case-signs-heading" className="flex flex-col gap-3">
          <h2 id="case-signs-heading" className="text-xl font-extrabold">
            What the batch is doing
          </h2>
          {detail.symptoms.length > 0 ? (
            <ul className="flex flex-wrap gap-2" aria-label="Symptoms">
              {detail.symptoms.map((s) => (
                <li key={s} className="rounded-full border-2 border-moss-deep bg-moss-mist px-3 py-0.5 font-semibold text-moss-deep">
                  {labelOf(SYMPTOMS, s)}
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-loam-soft">No symptoms ticked.</p>
          )}
          {detail.description && <p className="whitespace-pre-line">{detail.description}</p>}
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            {detail.location && (
              <>
                <dt className="text-loam-soft">Where it sits</dt>
                <dd>{detail.location}</dd>
              </>
            )}
            {detail.batch && (
              <>
                <dt className="text-loam-soft">Batch</dt>
                <dd>{ownsBatch ? <Link to={`/batches/${detail.batch.id}`}>{detail.batch.label}</Link> : detail.batch.label}</dd>
              </>
            )}
            {madeOn && (
              <>
                <dt className="text-loam-soft">Made on</dt>
                <dd>
                  {formatMadeOn(madeOn)}
                  {detail.batch && <> ({ageText(detail.batch.ageDays)}{detail.batch.ageDays > 0 ? ' old' : ''})</>}
                </dd>
              </>
            )}
          </dl>
        </section>

        <section aria-labelledby="case-numbers-heading" className="flex flex-col gap-3 rounded-soft border border-line bg-rice-deep p-4">
          <h2 id="case-numbers-heading" className="text-xl font-extrabold">
            The numbers and the check
          </h2>
          {numbers ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
              <dt className="text-loam-soft">Culture</dt>
              <dd>{`${numbers.culture.value} ${numbers.culture.unit}`}</dd>
              <dt className="text-loam-soft">Sugar</dt>
              <dd>
                {`${numbers.sugar.value} ${numbers.sugar.unit}`}
                {numbers.sugarType && ` of ${SUGAR_TYPES[numbers.sugarType].label}`}
              </dd>
              <dt className="text-loam-soft">Moisture</dt>
              <dd>{numbers.moisturePct === null ? 'the usual value for the stage' : `${numbers.moisturePct} %`}</dd>
              {check && (
                <>
                  <dt className="text-loam-soft">Ratio</dt>
                  <dd className="font-bold">{ratioText(check.ratio)}</dd>
                  {check.waterActivity && (
                    <>
                      <dt className="text-loam-soft">Water activity</dt>
                      <dd className="font-bold">about {check.waterActivity.estimate.toFixed(3)}</dd>
                    </>
                  )}
                  {check.sugarToAdd.grams > 0 && check.discardSigns.length === 0 && (
                    <>
                      <dt className="text-loam-soft">Sugar to add</dt>
                      <dd>{formatMass(check.sugarToAdd.grams, check.sugarToAdd.unit)}</dd>
                    </>
                  )}
                </>
              )}
            </dl>
          ) : (
            <p className="text-loam-soft">No weights were given, so there is no sugar &amp; water check.</p>
          )}
          {check && (
            <>
              <div className="flex flex-col gap-1">
                <RiskBadge risk={check.risk} className="self-start" />
                <p className="font-bold">{check.verdict}</p>
              </div>
              <details className="rounded-soft border border-line bg-rice p-3">
                <summary className="min-h-11 cursor-pointer content-center font-bold">The water activity picture and notes</summary>
                <WaterActivityScale estimate={check.waterActivity?.estimate ?? null} className="mt-3" />
                <ul className="mt-3 list-disc space-y-1 pl-5">
                  {check.notes.map((note) => (
                    <li key={note}>{note}</li>
                  ))}
                </ul>
              </details>
            </>
          )}
        </section>
      </div>
    </header>
  );
}
