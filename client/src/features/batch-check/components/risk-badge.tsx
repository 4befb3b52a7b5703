import type { BatchRisk } from '@shared/batch-check';
import { cx } from '../../../components/ui/cx';

export const RISK_LABELS: Record<BatchRisk, string> = {
  low: 'Low risk',
  medium: 'Medium risk',
  high: 'High risk',
};

const RISK_TONES: Record<BatchRisk, string> = {
  low: 'border-moss bg-moss-mist text-moss-deep',
  medium: 'border-clay bg-clay-mist text-clay-deep',
  high: 'border-ember bg-ember text-rice',
};

// A symbol beside the colour, so the badge reads the same without colour vision.
const RISK_MARKS: Record<BatchRisk, string> = { low: '●', medium: '▲', high: '■' };

export function RiskBadge({ risk, className }: { risk: BatchRisk; className?: string }) {
  return (
    <span
      className={cx(
        'inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border-2 px-2.5 py-0.5 text-sm font-extrabold',
        RISK_TONES[risk],
        className,
      )}
    >
      <span aria-hidden="true">{RISK_MARKS[risk]}</span>
      {RISK_LABELS[risk]}
    </span>
  );
}
