import { OUTCOME_LABELS, type Outcome } from '@shared/outcomes';
import { cx } from '../../../components/ui/cx';

const TONES: Record<Outcome, string> = {
  recovered: 'border-moss bg-moss-mist text-moss-deep',
  partly: 'border-clay bg-clay-mist text-clay-deep',
  lost: 'border-ember bg-ember-mist text-ember',
};

export function OutcomeBadge({ outcome, className }: { outcome: Outcome; className?: string }) {
  return (
    <span className={cx('inline-block rounded-full border-2 px-3 py-0.5 font-extrabold', TONES[outcome], className)}>
      <span className="sr-only">Outcome: </span>
      {OUTCOME_LABELS[outcome]}
    </span>
  );
}

export function KindBadge({ kind }: { kind: 'guide' | 'note' }) {
  return (
    <span className={cx('inline-block rounded-soft px-2 py-0.5 text-sm font-extrabold uppercase tracking-wide', kind === 'guide' ? 'bg-loam text-rice' : 'bg-clay-deep text-rice')}>
      {kind === 'guide' ? 'Guide' : 'Field note'}
    </span>
  );
}
