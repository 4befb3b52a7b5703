import { Link } from 'react-router';
import { conversationPath } from '@shared/case-links';
import { STATUS_LABELS } from '@shared/case-status';
import { Spinner } from '../../../components/ui/spinner';
import { dayShortMonth } from '../../../lib/english-dates';
import { useUnread } from '../../threads/api/get-unread';
import { useMyCases } from '../api/get-my-cases';

/** The grower's own cases, newest first, with where each stands; a case with replies not read
 * yet says how many and opens at its conversation. (The counts are the header badge's own.) */
export function MyCasesList() {
  const cases = useMyCases();
  const unread = useUnread(true).data?.byCase ?? {};
  if (cases.isPending) return <Spinner label="Fetching your cases…" />;
  if (cases.isError) return <p className="font-semibold text-ember">Your cases could not be shown: {cases.error.message}</p>;
  if (cases.data.items.length === 0) {
    return <p className="text-loam-soft">You have not opened a case yet. When a batch worries you, open one from its row above.</p>;
  }
  return (
    <ul className="flex flex-col divide-y divide-line rounded-soft border border-line">
      {cases.data.items.map((c) => {
        const fresh = unread[String(c.id)] ?? 0;
        return (
          <li key={c.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 px-4 py-3">
            <Link to={fresh > 0 ? conversationPath(c.id) : `/cases/${c.id}`} className="font-bold">
              {c.title}
              {fresh > 0 && (
                <span className="ml-2 inline-block rounded-full bg-moss px-2 text-sm font-extrabold text-rice no-underline">
                  {fresh} new<span className="sr-only"> {fresh === 1 ? 'message' : 'messages'}</span>
                </span>
              )}
            </Link>
            <span className="text-loam-soft">
              {STATUS_LABELS[c.status]} · opened {dayShortMonth(new Date(c.openedAt))}
            </span>
          </li>
        );
      })}
    </ul>
  );
}
