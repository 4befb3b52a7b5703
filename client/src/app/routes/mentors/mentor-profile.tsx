// A mentor's profile and track record (PRODUCT.md screen 9): cases helped, how fast they first
// reply, how often their advice saved the batch (with its 95 % range), the rating, recent notes.
import type { ReactNode } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { percentText } from '@shared/remedy-records';
import { DEFAULT_RATING_PRIOR } from '@shared/track-record';
import { REMEDIES, labelOf } from '@shared/vocabulary';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { routeIdOf } from '../../../features/batches/lib/route-id';
import { EntryTags } from '../../../features/library/components/entry-tags';
import { OutcomeBadge } from '../../../features/library/components/outcome-badge';
import { TrackRecordBar } from '../../../features/library/components/track-record-bar';
import { useUser } from '../../../features/auth/api/get-me';
import { mentorQueryOptions } from '../../../features/mentors/api/get-mentor';
import { AboutEditor } from '../../../features/mentors/components/about-editor';
import { monthYear } from '../../../lib/english-dates';

export const clientLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  await queryClient.ensureQueryData(mentorQueryOptions(routeIdOf(params.id)));
  return null;
};

function hoursText(hours: number): string {
  if (hours < 1) return `${Math.max(1, Math.round(hours * 60))} minutes`;
  if (hours < 48) return `${Math.round(hours * 10) / 10} hours`;
  return `${Math.round(hours / 24)} days`;
}

const monthText = (iso: string) => monthYear(new Date(iso));

function Stat({ label, value, children }: { label: string; value: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col gap-1 rounded-soft border border-line bg-rice-deep p-4">
      <dt className="font-bold text-loam-soft">{label}</dt>
      <dd className="flex flex-col gap-1">
        <span className="text-2xl font-extrabold">{value}</span>
        {children}
      </dd>
    </div>
  );
}

export default function MentorProfileRoute() {
  const id = routeIdOf(useParams().id);
  const { data: mentor } = useSuspenseQuery(mentorQueryOptions(id));
  const { record } = mentor;
  const isMe = useUser().data?.id === mentor.id;

  return (
    <ContentLayout
      title={mentor.displayName}
      lead={
        <>
          {mentor.role === 'steward' ? 'Steward' : 'Mentor'} on Sporewell since {monthText(mentor.memberSince)}.
          {mentor.about && <span className="mt-2 block whitespace-pre-line">{mentor.about}</span>}
        </>
      }
    >
      {isMe && <AboutEditor mentorId={mentor.id} about={mentor.about} />}
      <section aria-labelledby="record-heading" className="flex flex-col gap-4">
        <h2 id="record-heading" className="text-2xl font-extrabold">
          Track record
        </h2>
        <dl className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <Stat label="Cases helped" value={String(mentor.casesHelped)}>
            <span className="text-base text-loam-soft">closed with a cause and a remedy{mentor.casesOpen ? `; ${mentor.casesOpen} open now` : ''}</span>
          </Stat>
          <Stat label="First reply, usually within" value={mentor.medianHoursToFirstReply === null ? '—' : hoursText(mentor.medianHoursToFirstReply)}>
            <span className="text-base text-loam-soft">
              {mentor.repliesCounted ? `the median over ${mentor.repliesCounted} ${mentor.repliesCounted === 1 ? 'case' : 'cases'}` : 'no replies yet'}
            </span>
          </Stat>
          <Stat label="Batches saved" value={record.rate === null ? '—' : percentText(record.rate)}>
            {record.rate !== null && <TrackRecordBar rate={record.rate} lower={record.lower} upper={record.upper} className="my-1" />}
            <span className="text-base text-loam-soft">
              {record.trials === 0
                ? 'no recovery reports yet'
                : `${record.saved} of ${record.trials} batches${record.partly ? ` (${record.partly} of them partly)` : ''}; the true rate likely lies between ${percentText(record.lower)} and ${percentText(record.upper)}`}
            </span>
          </Stat>
          <Stat label="Advice rated" value={`${record.stars.average.toFixed(1)} of 5`}>
            <span className="text-base text-loam-soft">
              {record.stars.ratings === 0
                ? 'no ratings yet'
                : `from ${record.stars.ratings} ${record.stars.ratings === 1 ? 'rating' : 'ratings'}, weighed as if ${DEFAULT_RATING_PRIOR.priorWeight} more of ${DEFAULT_RATING_PRIOR.priorMean} came first, so a few ratings cannot swing it`}
            </span>
          </Stat>
        </dl>
      </section>

      <section aria-labelledby="notes-heading" className="mt-10 flex flex-col gap-4">
        <h2 id="notes-heading" className="text-2xl font-extrabold">
          Recent field notes
        </h2>
        {mentor.recentNotes.length === 0 ? (
          <p className="text-loam-soft">None of their cases is in the Field Library yet.</p>
        ) : (
          <ul className="flex flex-col gap-3">
            {mentor.recentNotes.map((note) => (
              <li key={note.slug} className="flex flex-col gap-2 rounded-soft border border-line bg-rice p-4">
                <Link to={`/library/${note.slug}`} className="text-lg font-extrabold">
                  {note.title}
                </Link>
                {note.remedy && (
                  <p className="text-loam-soft">
                    <span className="font-bold text-loam">What was done: </span>
                    {labelOf(REMEDIES, note.remedy)}
                  </p>
                )}
                <div className="flex flex-wrap items-center gap-2">
                  {note.outcome && <OutcomeBadge outcome={note.outcome} className="text-sm" />}
                  <EntryTags stages={note.stages} symptoms={[]} />
                </div>
              </li>
            ))}
          </ul>
        )}
      </section>
    </ContentLayout>
  );
}
