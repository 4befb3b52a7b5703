import { useId } from 'react';
import type { RemedyRecordView } from '@shared/library-schemas';
import { RemedyRecord } from './remedy-record';

/** Every remedy with a record, best first by the lower end of its 95 % range. */
export function RemedyRecordsPanel({ records }: { records: RemedyRecordView[] }) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-3 rounded-soft border border-line bg-rice-deep p-4 sm:p-5">
      <h2 id={headingId} className="text-xl font-extrabold">
        How the remedies hold up
      </h2>
      <p className="text-base text-loam-soft">
        From growers’ recovery reports. Ranked by the lower end of a 95 % range, so a remedy tried three times cannot outrank one that
        worked three hundred times. A batch saved only in part counts as saved, and is named.
      </p>
      {records.length === 0 ? (
        <p>No recovery reports yet.</p>
      ) : (
        <ol className="flex flex-col gap-3">
          {records.map((record) => (
            <li key={record.remedy}>
              <RemedyRecord record={record} />
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
