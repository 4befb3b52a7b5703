import type { RemedyRecordView } from '@shared/library-schemas';
import { cx } from '../../../components/ui/cx';
import { TrackRecordBar } from './track-record-bar';

/** "Mix in more sugar: saved 11 of 12 batches (lower bound 65 %)", with its picture. */
export function RemedyRecord({ record, showLabel = true, className }: { record: RemedyRecordView; showLabel?: boolean; className?: string }) {
  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <p>
        {showLabel && <span className="font-bold">{record.label}: </span>}
        {record.text}
      </p>
      {record.rescue !== false && <TrackRecordBar rate={record.rate} lower={record.lower} upper={record.upper} />}
    </div>
  );
}
