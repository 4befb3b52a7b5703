// The community-health charts. Each shows one series of GET /api/steward/metrics; the words
// and tables beside them carry the same numbers for screen readers and for exact reading.
import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
  type BarShapeProps,
} from 'recharts';
import type { MentorLoadRow } from '@shared/steward-schemas';
import { busiestText, strongestLead } from '../lib/summary-words';
import type { OpenByUrgency, RecoveryRate, WeekReplyTimes, WeekStageCounts } from '@shared/metrics';
import { labelOf, REMEDIES, STAGE_IDS, STAGES, type StageId } from '@shared/vocabulary';
import { cx } from '../../../components/ui/cx';
import { STAGE_COLOURS, TOKENS, withRice } from '../lib/chart-colours';
import { dayInWords, weekLabel } from '../lib/dates';
import { useWideScreen } from '../hooks/use-wide-screen';
import { ChartFigure, NumbersTable } from './chart-figure';

const AXIS = { fontSize: 13, fill: TOKENS.loamSoft };
const TOOLTIP = { contentStyle: { background: TOKENS.rice, border: `1px solid ${TOKENS.line}`, borderRadius: 12, color: TOKENS.loam } };
// Series keep their order (not alphabetical), and the words stay in loam for contrast.
const LEGEND = {
  itemSorter: null,
  wrapperStyle: { fontSize: 14 },
  formatter: (value: string) => <span style={{ color: TOKENS.loam }}>{value}</span>,
} as const;
const GRID = <CartesianGrid stroke={TOKENS.line} strokeDasharray="3 4" vertical={false} />;
// No animation: the numbers matter, not the motion (and it respects reduced motion for free).
const STILL = { isAnimationActive: false } as const;

export function formatHours(hours: number | null): string {
  if (hours === null) return '—';
  if (hours < 1) return `${Math.round(hours * 60)} min`;
  return `${hours < 10 ? hours.toFixed(1) : Math.round(hours)} h`;
}

const percent = (share: number | null) => (share === null ? '—' : `${Math.round(share * 100)} %`);
const stageShort = (id: string) => labelOf(STAGES, id).split(' — ')[0];
const remedyLabel = (id: string) => labelOf(REMEDIES, id);
const shorten = (text: string, max: number) => (text.length > max ? `${text.slice(0, max - 1)}…` : text);

// ---------------------------------------------------------------------------------------------

export function CasesPerWeekChart({ weeks, from, to }: { weeks: WeekStageCounts[]; from: string; to: string }) {
  const total = weeks.reduce((sum, w) => sum + w.total, 0);
  const stages = STAGE_IDS.filter((stage) => weeks.some((w) => w.byStage[stage] > 0));
  const busiest = weeks.reduce<WeekStageCounts | null>((best, w) => (!best || w.total > best.total ? w : best), null);
  const stageTotals = stages.map((stage) => ({ stage, n: weeks.reduce((sum, w) => sum + w.byStage[stage], 0) })).sort((a, b) => b.n - a.n);
  const data = weeks.map((w) => ({ week: weekLabel(w.week), ...w.byStage }));

  const summary =
    total === 0 ? (
      <p>No cases were opened between {dayInWords(from)} and {dayInWords(to)}.</p>
    ) : (
      <p>
        {total} {total === 1 ? 'case was' : 'cases were'} opened between {dayInWords(from)} and {dayInWords(to)}. The busiest week began{' '}
        {dayInWords(busiest!.week)}, with {busiest!.total}. The most common stage was {stageShort(stageTotals[0].stage)} ({stageTotals[0].n}).
      </p>
    );

  return (
    <ChartFigure
      title="Cases opened per week, by stage"
      summary={summary}
      chart={
        total === 0 ? null : (
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -16 }} accessibilityLayer={false}>
              {GRID}
              <XAxis dataKey="week" tick={AXIS} interval="preserveStartEnd" minTickGap={12} />
              <YAxis allowDecimals={false} tick={AXIS} />
              <Tooltip {...TOOLTIP} />
              <Legend {...LEGEND} />
              {stages.map((stage) => (
                <Bar key={stage} dataKey={stage} name={stageShort(stage)} stackId="stage" fill={STAGE_COLOURS[stage]} stroke={TOKENS.rice} strokeWidth={1} {...STILL} />
              ))}
            </BarChart>
          </ResponsiveContainer>
        )
      }
      table={
        <NumbersTable
          caption="Cases opened per week, by stage"
          head={['Week beginning', 'All', ...stages.map(stageShort)]}
          rows={weeks.map((w) => [weekLabel(w.week), w.total, ...stages.map((s: StageId) => w.byStage[s])])}
        />
      }
    />
  );
}

// ---------------------------------------------------------------------------------------------

export function ReplyTimesChart({ weeks }: { weeks: WeekReplyTimes[] }) {
  const opened = weeks.reduce((sum, w) => sum + w.opened, 0);
  const replied = weeks.reduce((sum, w) => sum + w.replied, 0);
  const latest = [...weeks].reverse().find((w) => w.replied > 0);
  const data = weeks.map((w) => ({ week: weekLabel(w.week), median: w.medianHours, p90: w.p90Hours }));

  const summary =
    replied === 0 ? (
      <p>{opened === 0 ? 'No cases were opened in this range.' : `None of the ${opened} cases opened in this range has had a mentor reply yet.`}</p>
    ) : (
      <p>
        {replied} of {opened} cases opened in this range have had a mentor reply. In the latest week with replies (beginning {dayInWords(latest!.week)}), half
        were answered within {formatHours(latest!.medianHours)} and nine in ten within {formatHours(latest!.p90Hours)}.
      </p>
    );

  return (
    <ChartFigure
      title="Hours to a mentor's first reply"
      summary={summary}
      chart={
        replied === 0 ? null : (
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={data} margin={{ top: 8, right: 12, bottom: 0, left: -16 }} accessibilityLayer={false}>
              {GRID}
              <XAxis dataKey="week" tick={AXIS} interval="preserveStartEnd" minTickGap={12} />
              <YAxis tick={AXIS} unit=" h" width={64} />
              <Tooltip {...TOOLTIP} formatter={(value) => formatHours(typeof value === 'number' ? value : null)} />
              <Legend {...LEGEND} />
              <Line type="linear" dataKey="median" name="Median (half answered within)" stroke={TOKENS.moss} strokeWidth={3} dot={{ r: 4 }} connectNulls {...STILL} />
              <Line
                type="linear"
                dataKey="p90"
                name="90th percentile (nine in ten within)"
                stroke={TOKENS.clay}
                strokeWidth={3}
                strokeDasharray="7 4"
                dot={{ r: 4, strokeDasharray: '' }}
                connectNulls
                {...STILL}
              />
            </LineChart>
          </ResponsiveContainer>
        )
      }
      table={
        <NumbersTable
          caption="Hours to a mentor's first reply, by the week the case was opened"
          head={['Week beginning', 'Opened', 'Replied', 'Median', '90th percentile']}
          rows={weeks.map((w) => [weekLabel(w.week), w.opened, w.replied, formatHours(w.medianHours), formatHours(w.p90Hours)])}
        />
      }
    />
  );
}

// ---------------------------------------------------------------------------------------------

/** A category label on one line, cut short with an ellipsis (the table has it in full). */
function OneLineTick({ x, y, payload, max }: { x?: number; y?: number; payload?: { value: string }; max: number }) {
  return (
    <text x={x} y={y} dy={4} textAnchor="end" fontSize={AXIS.fontSize} fill={AXIS.fill}>
      {shorten(payload?.value ?? '', max)}
    </text>
  );
}

/** The likely range as a pale bar, and the observed rate as a dark tick across it. */
function RangeWithRate(props: BarShapeProps) {
  const { x, y, width, height, payload } = props;
  const { rate, lower, upper } = payload as { rate: number; lower: number; upper: number };
  const span = upper - lower;
  const at = x + (span > 0 ? ((rate - lower) / span) * width : 0);
  return (
    <g>
      <rect x={x} y={y} width={Math.max(width, 2)} height={height} rx={4} fill={withRice(TOKENS.moss, 0.4)} stroke={TOKENS.moss} strokeWidth={1.5} />
      <rect x={at - 2} y={y - 4} width={4} height={height + 8} fill={TOKENS.loam} />
    </g>
  );
}

export function RecoveryChart({ title, rates, kind }: { title: string; rates: RecoveryRate[]; kind: 'stage' | 'remedy' }) {
  const wide = useWideScreen();
  const name = kind === 'stage' ? stageShort : remedyLabel;
  const best = rates[0];
  // Records ranked first together (the same counts, so the same range) are named together.
  const tied = best ? rates.filter((r) => r.recovered === best.recovered && r.trials === best.trials) : [];
  const data = rates.map((r) => ({ name: name(r.key), rate: r.rate ?? 0, lower: r.lower, upper: r.upper, range: [r.lower, r.upper] }));
  const labelChars = kind === 'stage' ? 14 : wide ? 22 : 15;

  const summary =
    rates.length === 0 ? (
      <p>No cases ended (recovered or lost) in this range.</p>
    ) : (
      <p>
        {strongestLead(tied.map((r) => name(r.key)), kind === 'stage' ? 'stages' : 'remedies')}
        {best.recovered} of {best.trials} recovered{tied.length > 1 ? ' each' : ''} ({percent(best.rate)}; the true rate likely lies between{' '}
        {percent(best.lower)} and {percent(best.upper)}). Each bar spans that likely range (a 95 % Wilson interval) and the dark mark is the rate seen. A short
        record has a long bar, so records are ranked by the low end.
      </p>
    );

  return (
    <ChartFigure
      title={title}
      summary={summary}
      height={Math.max(140, 40 * rates.length + 48)}
      chart={
        rates.length === 0 ? null : (
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} layout="vertical" margin={{ top: 8, right: 16, bottom: 4, left: 4 }} accessibilityLayer={false}>
              <CartesianGrid stroke={TOKENS.line} strokeDasharray="3 4" horizontal={false} />
              <XAxis type="number" domain={[0, 1]} ticks={[0, 0.25, 0.5, 0.75, 1]} tickFormatter={(v: number) => `${Math.round(v * 100)} %`} tick={AXIS} />
              <YAxis type="category" dataKey="name" width={labelChars * 7 + 12} tick={<OneLineTick max={labelChars} />} interval={0} />
              <Tooltip
                {...TOOLTIP}
                formatter={(_value, _name, item) => {
                  const row = item.payload as { rate: number; lower: number; upper: number };
                  return [`${percent(row.rate)} (likely ${percent(row.lower)} – ${percent(row.upper)})`, 'Recovered'];
                }}
              />
              <Bar dataKey="range" name="Recovered" barSize={18} shape={RangeWithRate} {...STILL} />
            </BarChart>
          </ResponsiveContainer>
        )
      }
      table={
        <NumbersTable
          caption={title}
          head={[kind === 'stage' ? 'Stage' : 'Remedy', 'Recovered', 'Lost', 'Rate', 'Likely range (95 %)']}
          rows={rates.map((r) => [name(r.key), r.recovered, r.lost, percent(r.rate), `${percent(r.lower)} – ${percent(r.upper)}`])}
        />
      }
    />
  );
}

// ---------------------------------------------------------------------------------------------

const URGENCY_TILES: Array<{ key: keyof Omit<OpenByUrgency, 'total'>; label: string; tone: string }> = [
  { key: 'high', label: 'High urgency', tone: 'border-ember bg-ember-mist' },
  { key: 'medium', label: 'Medium urgency', tone: 'border-clay bg-clay-mist' },
  { key: 'low', label: 'Low urgency', tone: 'border-moss bg-moss-mist' },
  { key: 'unknown', label: 'Not scored yet', tone: 'border-line bg-rice-deep' },
];

/** Four numbers read better as numbers than as a chart. */
export function OpenByUrgencyTiles({ open }: { open: OpenByUrgency }) {
  return (
    <section aria-labelledby="open-urgency-heading" className="rounded-soft border border-line bg-rice p-4 sm:p-5">
      <h3 id="open-urgency-heading" className="text-lg font-extrabold">
        Open cases right now, by urgency
      </h3>
      <p className="mt-1 text-loam-soft">
        {open.total === 0 ? 'No case is open at the moment.' : `${open.total} ${open.total === 1 ? 'case is' : 'cases are'} open: awaiting a mentor, in conversation or over to the grower.`}
      </p>
      <ul className="mt-4 grid grid-cols-2 gap-3 sm:grid-cols-4">
        {URGENCY_TILES.filter((tile) => tile.key !== 'unknown' || open.unknown > 0).map((tile) => (
          <li key={tile.key} className={cx('rounded-soft border-l-8 px-4 py-3', tile.tone)}>
            <span className="block text-3xl font-extrabold tabular-nums">{open[tile.key]}</span>
            <span className="block font-bold">{tile.label}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}

// ---------------------------------------------------------------------------------------------

export function MentorLoadChart({ loads }: { loads: MentorLoadRow[] }) {
  const holding = loads.filter((l) => l.open > 0);
  const openTotal = loads.reduce((sum, l) => sum + l.open, 0);
  const busiest = busiestText(loads);
  const wide = useWideScreen();
  const data = loads.map((l) => ({ name: l.displayName, open: l.open, watching: l.watching, resolved: l.resolved }));

  const summary =
    loads.length === 0 ? (
      <p>There are no mentors yet.</p>
    ) : (
      <p>
        {holding.length} of {loads.length} mentors hold open cases ({openTotal} in all)
        {busiest ? `; ${busiest}` : ''}. Resolved counts
        cases that ended in this range.
      </p>
    );

  return (
    <ChartFigure
      title="Mentors' load"
      summary={summary}
      height={Math.max(140, 40 * loads.length + 72)}
      chart={
        loads.length === 0 ? null : (
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} layout="vertical" margin={{ top: 4, right: 16, bottom: 4, left: 4 }} accessibilityLayer={false}>
              <CartesianGrid stroke={TOKENS.line} strokeDasharray="3 4" horizontal={false} />
              <XAxis type="number" allowDecimals={false} tick={AXIS} />
              <YAxis type="category" dataKey="name" width={wide ? 150 : 110} tick={<OneLineTick max={wide ? 20 : 14} />} interval={0} />
              <Tooltip {...TOOLTIP} />
              <Legend {...LEGEND} />
              <Bar dataKey="open" name="Open" stackId="load" fill={TOKENS.clay} stroke={TOKENS.rice} barSize={20} {...STILL} />
              <Bar dataKey="watching" name="Watching" stackId="load" fill={withRice(TOKENS.clay, 0.45)} stroke={TOKENS.rice} barSize={20} {...STILL} />
              <Bar dataKey="resolved" name="Resolved in range" stackId="load" fill={TOKENS.moss} stroke={TOKENS.rice} barSize={20} {...STILL} />
            </BarChart>
          </ResponsiveContainer>
        )
      }
      table={
        <NumbersTable
          caption="Mentors' load"
          head={['Mentor', 'Open', 'Watching', 'Resolved in range']}
          rows={loads.map((l) => [l.displayName, l.open, l.watching, l.resolved])}
        />
      }
    />
  );
}
