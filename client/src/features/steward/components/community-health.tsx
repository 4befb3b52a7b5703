import { useState } from 'react';
import { weekStart } from '@shared/metrics';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { useMetrics, type MetricsRange } from '../api/get-metrics';
import { daysAgo, dayInWords } from '../lib/dates';
import { SelectField } from './form-controls';
import { CasesPerWeekChart, MentorLoadChart, OpenByUrgencyTiles, RecoveryChart, ReplyTimesChart } from './health-charts';

const RANGES = [
  { weeks: 12, label: 'The last 12 weeks' },
  { weeks: 26, label: 'The last 6 months' },
  { weeks: 52, label: 'The last year' },
] as const;

/** This week and the weeks before it; 12 weeks is the server's own default, so it sends nothing. */
function rangeOf(weeks: number): MetricsRange {
  if (weeks === 12) return {};
  return { from: weekStart(daysAgo((weeks - 1) * 7)), to: daysAgo(0) };
}

export function CommunityHealth() {
  const [weeks, setWeeks] = useState<number>(12);
  const metrics = useMetrics(rangeOf(weeks));

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end gap-4">
        <SelectField label="Show" value={weeks} onChange={(e) => setWeeks(Number(e.target.value))} className="w-full sm:w-64">
          {RANGES.map((r) => (
            <option key={r.weeks} value={r.weeks}>
              {r.label}
            </option>
          ))}
        </SelectField>
        {metrics.data && (
          <p className="pb-3 text-loam-soft">
            {dayInWords(metrics.data.from)} to {dayInWords(metrics.data.to)}
            {metrics.isFetching && <span className="sr-only"> (updating)</span>}
          </p>
        )}
      </div>

      {metrics.isPending && <Spinner label="Counting cases…" />}
      {metrics.isError && (
        <Alert tone="danger" title="The numbers could not be loaded">
          {metrics.error.message}
        </Alert>
      )}
      {metrics.data && (
        <>
          <OpenByUrgencyTiles open={metrics.data.openByUrgency} />
          <div className="grid gap-5 lg:grid-cols-2">
            <CasesPerWeekChart weeks={metrics.data.casesPerWeek} from={metrics.data.from} to={metrics.data.to} />
            <ReplyTimesChart weeks={metrics.data.firstReply} />
            <RecoveryChart title="Recovery rate by stage" rates={metrics.data.recoveryByStage} kind="stage" />
            <RecoveryChart title="Recovery rate by remedy" rates={metrics.data.recoveryByRemedy} kind="remedy" />
          </div>
          <MentorLoadChart loads={metrics.data.mentorLoad} />
        </>
      )}
    </div>
  );
}
