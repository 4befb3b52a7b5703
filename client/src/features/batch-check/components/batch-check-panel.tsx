import { useId, type ReactNode } from 'react';
import type { BatchCheckResult } from '@shared/batch-check';
import { formatMass } from '@shared/units';
import { cx } from '../../../components/ui/cx';
import type { LiveBatchCheck } from '../hooks/use-live-batch-check';
import { RiskBadge } from './risk-badge';
import { ratioText, targetText } from './ratio-text';
import { WaterActivityScale } from './water-activity-scale';

/** The sugar & water check beside a form: the verdict, the key numbers, the picture and the
 * notes. Announced politely as it changes, so a screen-reader user hears the new verdict. */
export function BatchCheckPanel({
  check,
  headingLevel = 2,
  incompleteHint,
  className,
}: {
  check: LiveBatchCheck;
  headingLevel?: 2 | 3;
  /** what to say instead of "fill in …" when the numbers are not there */
  incompleteHint?: ReactNode;
  className?: string;
}) {
  const headingId = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section aria-labelledby={headingId} className={cx('rounded-soft border border-line bg-rice-deep p-4 sm:p-5', className)}>
      <Heading id={headingId} className="text-xl font-extrabold">
        Sugar &amp; water check
      </Heading>
      {check.state === 'incomplete' ? (
        <div className="mt-3">
          <p>{incompleteHint ?? <>To see the check, fill in {joinNeeds(check.needs)}.</>}</p>
          <WaterActivityScale estimate={null} className="mt-4" />
        </div>
      ) : (
        <CheckResult result={check.result} subHeading={headingLevel === 2 ? 'h3' : 'h4'} />
      )}
    </section>
  );
}

function joinNeeds(needs: string[]): string {
  const plain = needs.map((n) => n.replace(/\.$/, ''));
  if (plain.length <= 1) return plain.join('');
  return `${plain.slice(0, -1).join(', ')} and ${plain[plain.length - 1]}`;
}

function CheckResult({ result, subHeading: SubHeading }: { result: BatchCheckResult; subHeading: 'h3' | 'h4' }) {
  const aw = result.waterActivity;
  const unit = result.sugarToAdd.unit;
  return (
    <div className="mt-3 flex flex-col gap-4">
      <div aria-live="polite" className="flex flex-col gap-2">
        <RiskBadge risk={result.risk} className="self-start" />
        <p className="text-lg font-bold">{result.verdict}</p>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="text-loam-soft">Ratio</dt>
        <dd className="font-bold">{ratioText(result.ratio)}</dd>
        <dt className="text-loam-soft">Usual rule</dt>
        <dd>{targetText(result.targetRatio)}</dd>
        {/* With a discard sign, more sugar is not the answer. */}
        {result.sugarToAdd.grams > 0 && result.discardSigns.length === 0 && (
          <>
            <dt className="text-loam-soft">Sugar to add</dt>
            <dd className="font-bold">{formatMass(result.sugarToAdd.grams, unit)}</dd>
          </>
        )}
        {result.targetRatio !== null && (
          <>
            <dt className="text-loam-soft">Scale at the end</dt>
            <dd>
              {formatMass(result.scaleReading.zeroed.grams, unit)} with the container zeroed
              {result.scaleReading.withContainer && <>, {formatMass(result.scaleReading.withContainer.grams, unit)} with it</>}
            </dd>
          </>
        )}
        <dt className="text-loam-soft">Water activity</dt>
        <dd className="font-bold">{aw ? `about ${aw.estimate.toFixed(3)}` : 'no estimate (moisture unknown)'}</dd>
      </dl>
      <WaterActivityScale estimate={aw?.estimate ?? null} />
      <div>
        <SubHeading className="font-extrabold">What the numbers say</SubHeading>
        <ul className="mt-1 list-disc space-y-1 pl-5">
          {result.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
        {aw && <p className="mt-2 text-sm text-loam-soft">Moisture used: {aw.moisturePct} % — {aw.moistureSource}.</p>}
      </div>
    </div>
  );
}
