import { useId } from 'react';
import { GROWTH_LIMITS, WATER_ACTIVITY_SCALE, canGrowAt, type GrowthGroupId } from '@shared/batch-check-model';
import { cx } from '../../../components/ui/cx';

/** The lines a grower needs on the picture. Gram-positive bacteria (0.90) sit a hair under
 * "most bacteria" and halophiles need salt that sugar batches lack, so both stay off it. */
const PICTURED: ReadonlyArray<{ group: GrowthGroupId; short: string }> = [
  { group: 'gram-negative-bacteria', short: 'Gram-negative bacteria' },
  { group: 'bacteria', short: 'Most bacteria' },
  { group: 'yeasts', short: 'Most yeasts' },
  { group: 'moulds', short: 'Most moulds' },
  { group: 'xerophilic-moulds', short: 'Dry-loving moulds' },
  { group: 'osmophilic-yeasts', short: 'Sugar-loving yeasts' },
];

export const PICTURED_LIMITS = PICTURED.map(({ group, short }) => {
  const limit = GROWTH_LIMITS.find((l) => l.group === group)!;
  return { group, short, label: limit.label, minAw: limit.minAw };
});

// Drawing geometry, in SVG user units. The picture is drawn upright (wet at the top, dry at the
// bottom) so that on a phone every label can be set at a readable size beside its line.
const WIDTH = 356;
const TOP = 18;
const BAR_HEIGHT = 300;
const BAR_X = 96;
const BAR_WIDTH = 30;
const LABEL_X = BAR_X + BAR_WIDTH + 30;
const LABEL_GAP = 19;
const HEIGHT = TOP + BAR_HEIGHT + 20;

const { min: MIN, max: MAX } = WATER_ACTIVITY_SCALE;

function yOf(aw: number): number {
  const clamped = Math.min(MAX, Math.max(MIN, aw));
  return TOP + ((MAX - clamped) / (MAX - MIN)) * BAR_HEIGHT;
}

/** Spreads label positions so none are closer than LABEL_GAP, keeping them inside the bar's
 * height: 0.60 and 0.61 are only a few units apart on the scale. */
export function spreadLabels(ys: readonly number[], gap = LABEL_GAP, low = TOP, high = TOP + BAR_HEIGHT): number[] {
  const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
  const placed = order.map((o) => o.y);
  for (let k = 1; k < placed.length; k++) placed[k] = Math.max(placed[k], placed[k - 1] + gap);
  if (placed.length > 0 && placed[placed.length - 1] > high) {
    placed[placed.length - 1] = high;
    for (let k = placed.length - 2; k >= 0; k--) placed[k] = Math.min(placed[k], placed[k + 1] - gap);
  }
  if (placed.length > 0) placed[0] = Math.max(placed[0], low);
  const result = new Array<number>(ys.length);
  order.forEach((o, k) => (result[o.i] = placed[k]));
  return result;
}

const ZONES = [
  { from: 0.91, to: MAX, className: 'fill-ember-mist', name: 'bacteria can grow' },
  { from: 0.8, to: 0.91, className: 'fill-clay-mist', name: 'yeasts and moulds can grow' },
  { from: MIN, to: 0.8, className: 'fill-moss-mist', name: 'only dry- and sugar-loving kinds' },
];

export function describeEstimate(estimate: number): string {
  const growing = PICTURED_LIMITS.filter((l) => canGrowAt(estimate, l.minAw)).map((l) => l.short.toLowerCase());
  const held = PICTURED_LIMITS.filter((l) => !canGrowAt(estimate, l.minAw)).map((l) => l.short.toLowerCase());
  const parts = [];
  if (growing.length) parts.push(`can still grow: ${growing.join(', ')}`);
  if (held.length) parts.push(`held back: ${held.join(', ')}`);
  return parts.join('; ');
}

export function formatAw(aw: number): string {
  return aw.toFixed(2);
}

/**
 * The water-activity scale from 0.60 to 1.00 with the growth limits marked and this batch's
 * estimate as a pointer. The SVG carries a short name; the list under it says the same in
 * words, so nothing depends on seeing the drawing.
 */
export function WaterActivityScale({ estimate, className }: { estimate: number | null; className?: string }) {
  const id = useId();
  const captionId = `${id}-caption`;
  const labelYs = spreadLabels(PICTURED_LIMITS.map((l) => yOf(l.minAw)));
  const below = estimate !== null && estimate < MIN;
  const estimateText =
    estimate === null
      ? 'No estimate for this batch yet.'
      : `This batch: about ${estimate.toFixed(3)}${below ? ', below the bottom of the scale' : ''}.`;
  const svgName =
    estimate === null
      ? 'Water activity scale from 0.60 to 1.00 with growth limits; no estimate for this batch yet'
      : `Water activity scale from 0.60 to 1.00: this batch at about ${formatAw(estimate)}; ${describeEstimate(estimate)}`;

  return (
    <figure aria-labelledby={captionId} className={cx('flex flex-col gap-3', className)}>
      <figcaption id={captionId} className="font-extrabold">
        Water activity picture
      </figcaption>
      <svg
        role="img"
        aria-label={svgName}
        viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
        className="h-auto w-full max-w-sm self-center font-sans"
      >
        {/* Zones behind the bar. */}
        {ZONES.map((zone) => (
          <rect
            key={zone.name}
            x={BAR_X}
            y={yOf(zone.to)}
            width={BAR_WIDTH}
            height={yOf(zone.from) - yOf(zone.to)}
            className={zone.className}
          />
        ))}
        <rect x={BAR_X} y={TOP} width={BAR_WIDTH} height={BAR_HEIGHT} className="fill-none stroke-loam" strokeWidth="2" />

        {/* End values of the scale. */}
        <text x={BAR_X + BAR_WIDTH / 2} y={TOP - 5} textAnchor="middle" className="fill-loam-soft text-[12px]">
          1.00 wet
        </text>
        <text x={BAR_X + BAR_WIDTH / 2} y={TOP + BAR_HEIGHT + 16} textAnchor="middle" className="fill-loam-soft text-[12px]">
          0.60 dry
        </text>

        {/* Growth limits: a line across the bar, a leader to the label. */}
        {PICTURED_LIMITS.map((limit, i) => {
          const y = yOf(limit.minAw);
          const ly = labelYs[i];
          const grows = estimate !== null && canGrowAt(estimate, limit.minAw);
          return (
            <g key={limit.group}>
              <line x1={BAR_X} x2={BAR_X + BAR_WIDTH + 6} y1={y} y2={y} className="stroke-loam" strokeWidth="1.5" />
              <polyline
                points={`${BAR_X + BAR_WIDTH + 6},${y} ${LABEL_X - 6},${ly} ${LABEL_X - 2},${ly}`}
                className="fill-none stroke-loam-soft"
                strokeWidth="1"
              />
              <text x={LABEL_X} y={ly + 4.5} className={cx('text-[13px]', grows ? 'fill-ember font-bold' : 'fill-loam')}>
                <tspan className="font-bold">{limit.minAw.toFixed(2)}</tspan> {limit.short}
              </text>
            </g>
          );
        })}

        {/* This batch. */}
        {estimate !== null && (
          <g>
            <line
              x1={BAR_X - 4}
              x2={BAR_X + BAR_WIDTH}
              y1={yOf(estimate)}
              y2={yOf(estimate)}
              className="stroke-moss-deep"
              strokeWidth="4"
            />
            <path
              d={`M ${BAR_X - 4} ${yOf(estimate)} l -14 -9 v 18 z`}
              className="fill-moss-deep"
            />
            <text x={BAR_X - 22} y={yOf(estimate) - 2} textAnchor="end" className="fill-moss-deep text-[13px] font-extrabold">
              this batch
            </text>
            <text x={BAR_X - 22} y={yOf(estimate) + 14} textAnchor="end" className="fill-moss-deep text-[15px] font-extrabold">
              {below ? '< 0.60' : formatAw(estimate)}
            </text>
          </g>
        )}
      </svg>

      <div className="text-base">
        <p className="font-bold">{estimateText}</p>
        <table className="mt-1 w-full border-collapse text-left">
          <caption className="sr-only">Growth limits on the scale, and whether each group can grow in this batch</caption>
          <thead className="sr-only">
            <tr>
              <th scope="col">Lowest water activity</th>
              <th scope="col">Group</th>
              <th scope="col">In this batch</th>
            </tr>
          </thead>
          <tbody>
            {PICTURED_LIMITS.map((limit) => {
              const grows = estimate === null ? null : canGrowAt(estimate, limit.minAw);
              return (
                <tr key={limit.group} className="border-b border-line/60 align-top last:border-b-0">
                  <td className="py-0.5 pr-3 font-bold tabular-nums">{limit.minAw.toFixed(2)}</td>
                  <td className="py-0.5 pr-3">{limit.label}</td>
                  <td className={cx('py-0.5 text-right whitespace-nowrap', grows ? 'font-bold text-ember' : 'text-moss-deep')}>
                    {grows === null ? '' : grows ? 'can grow' : 'held back'}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <p className="mt-2 text-loam-soft">
          Water activity is how much of the water microbes can use: 1.00 is pure water. Each group needs at least its line to grow.
        </p>
      </div>
    </figure>
  );
}
