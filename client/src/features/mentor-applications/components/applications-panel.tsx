import { useState } from 'react';
import { APPLICATION_STATUS_LABELS, APPLICATION_STATUSES, NOTE_MAX, type ApplicationStatus, type MentorApplication } from '@shared/steward-schemas';
import { labelOf, STAGES } from '@shared/vocabulary';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { isApiError } from '../../../lib/api-client';
import { TextAreaField } from '../../steward/components/form-controls';
import { DoneNotice, PagedList, StatusSelect, useStatusPages } from '../../steward/components/paged-list';
import { formatDate, formatDateTime } from '../../steward/lib/dates';
import { useApplications } from '../api/get-applications';
import { useDecideApplication } from '../api/decide-application';

const STATUS_OPTIONS = APPLICATION_STATUSES.map((s) => ({ value: s, label: s === 'pending' ? 'Waiting for a decision' : APPLICATION_STATUS_LABELS[s] }));

export function ApplicationsPanel() {
  const { status, setStatus, page, setPage, done, setDone } = useStatusPages<ApplicationStatus>('pending');
  const applications = useApplications({ status, page });

  return (
    <div>
      <StatusSelect value={status} options={STATUS_OPTIONS} onChange={setStatus} />
      <DoneNotice message={done} />
      <PagedList
        query={applications}
        loadingLabel="Loading applications…"
        errorTitle="The applications could not be loaded"
        empty={status === 'pending' ? 'No application is waiting. When a grower applies to mentor, it appears here.' : 'None yet.'}
        page={page}
        onPage={setPage}
        pagerLabel="Pages of applications"
        renderItem={(application) => <ApplicationCard application={application} onDecided={setDone} />}
      />
    </div>
  );
}

function ApplicationCard({ application, onDecided }: { application: MentorApplication; onDecided: (message: string) => void }) {
  const [note, setNote] = useState('');
  const decide = useDecideApplication();
  const name = application.applicant.displayName;
  const noteError = isApiError(decide.error, 400) ? decide.error.fields?.note : undefined;
  const headingId = `application-${application.id}`;
  const disabled = application.applicant.disabled === true;

  // mutateAsync, not mutate's callbacks: once decided, this card leaves the pending list and
  // unmounts, and per-call callbacks of an unmounted mutation are never called.
  const send = (decision: 'approved' | 'declined') =>
    decide
      .mutateAsync({ id: application.id, input: { decision, note } })
      .then(() =>
        onDecided(
          decision === 'approved'
            ? `${name} is a mentor now and has been e-mailed. They see the rounds without signing in again.`
            : disabled
              ? `${name}'s application was declined. No e-mail went out, since the account is disabled.`
              : `${name}'s application was declined and they have been e-mailed your note.`,
        ),
      )
      .catch(() => undefined); // shown from decide.error

  return (
    <Card className="bg-rice" aria-labelledby={headingId} role="group">
      <div className="flex flex-col gap-1 sm:flex-row sm:items-baseline sm:justify-between">
        <h3 id={headingId} className="text-xl font-extrabold">
          {name}
        </h3>
        <p className="text-loam-soft">Applied {formatDate(application.createdAt)}</p>
      </div>
      <p className="text-loam-soft">
        {application.applicant.email} · grows at {application.region}
      </p>
      <p className="mt-3">
        <span className="font-bold">Stages they know well:</span> {application.stages.map((s) => labelOf(STAGES, s)).join('; ')}
      </p>
      <p className="mt-3 font-bold">In their words</p>
      <blockquote className="mt-1 whitespace-pre-wrap border-l-4 border-moss pl-3">{application.experience}</blockquote>

      {application.status === 'pending' ? (
        <div className="mt-5 flex flex-col gap-3">
          {disabled && (
            <Alert tone="warning" title="This account is disabled">
              {name} cannot be approved while it is; enable the account under People first. Declining is recorded, and no e-mail goes out.
            </Alert>
          )}
          <TextAreaField
            label={disabled ? 'Note for the record' : `Note to ${name}`}
            hint={disabled ? 'Kept with the decision. Needed when you decline.' : 'Sent with the decision. Needed when you decline, so they know what to work on.'}
            value={note}
            maxLength={NOTE_MAX}
            onChange={(e) => setNote(e.target.value)}
            error={noteError}
            rows={3}
          />
          {decide.isError && !noteError && (
            <Alert tone="danger" title="That did not go through">
              {decide.error.message}
            </Alert>
          )}
          <div className="flex flex-wrap gap-3">
            {!disabled && (
              <Button onClick={() => send('approved')} disabled={decide.isPending}>
                {decide.isPending && decide.variables?.input.decision === 'approved' ? 'Approving…' : `Approve ${name} as a mentor`}
              </Button>
            )}
            <Button variant="secondary" onClick={() => send('declined')} disabled={decide.isPending}>
              {decide.isPending && decide.variables?.input.decision === 'declined' ? 'Declining…' : 'Decline'}
            </Button>
          </div>
        </div>
      ) : (
        <p className="mt-4 rounded-soft bg-rice-deep px-3 py-2">
          <span className="font-bold">{APPLICATION_STATUS_LABELS[application.status]}</span>
          {application.decidedBy && ` by ${application.decidedBy.displayName}`}
          {application.decidedAt && ` on ${formatDateTime(application.decidedAt)}`}
          {application.note && <>: “{application.note}”</>}
        </p>
      )}
    </Card>
  );
}
