import { Link } from 'react-router';
import { STATUS_LABELS } from '@shared/case-status';
import { Spinner } from '../../../components/ui/spinner';
import { dayShortMonth } from '../../../lib/english-dates';
import { useMyCases } from '../api/get-my-cases';

/** The grower's own cases, newest first, with where each stands. */
export function MyCasesList() {
  const cases = useMyCases();
  if (cases.isPending) return <Spinner label="Fetching your cases…" />;
  if (cases.isError) return <p className="font-semibold text-ember">Your cases could not be shown: {cases.error.message}</p>;
  if (cases.data.items.length === 0) {
    return <p className="text-loam-soft">You have not opened a case yet. When a batch worries you, open one from its row above.</p>;
  }
  return (
    <ul className="flex flex-col divide-y divide-line rounded-soft border border-line">
      {cases.data.items.map((c) => (
        <li key={c.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 px-4 py-3">
          <Link to={`/cases/${c.id}`} className="font-bold">
            {c.title}
          </Link>
          <span className="text-loam-soft">
            {STATUS_LABELS[c.status]} · opened {dayShortMonth(new Date(c.openedAt))}
          </span>
        </li>
      ))}
    </ul>
  );
}
