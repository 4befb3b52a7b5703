// On the rounds, below the list: which e-mails this mentor gets. Each box is saved as soon as it
// changes; the mails themselves link back here (MAIL_SETTINGS_ANCHOR) to turn them off.
import { useId, type ReactNode } from 'react';
import { MAIL_SETTINGS_ANCHOR } from '@shared/case-links';
import { GROWER_WROTE_MAIL_MINUTES, REPLY_MAIL_WINDOW_MINUTES, URGENT_WAIT_MINUTES } from '@shared/urgency';
import { Card } from '../../../components/ui/card';
import { useMailChoice, useSetMailChoice, type MailChoice } from '../api/mail-choices';


function ChoiceBox({ choice, label, onText, offText }: { choice: MailChoice; label: ReactNode; onText: string; offText: string }) {
  const current = useMailChoice(choice);
  const save = useSetMailChoice(choice);
  const statusId = useId();
  const on = save.isPending ? save.variables : current.data?.on;
  return (
    <div>
      <label className="flex min-h-11 cursor-pointer items-start gap-3">
        <input
          type="checkbox"
          className="mt-1 size-5 shrink-0 accent-moss"
          checked={on ?? false}
          disabled={current.isPending || save.isPending}
          aria-describedby={statusId}
          onChange={(e) => save.mutate(e.target.checked)}
        />
        <span>{label}</span>
      </label>
      <p id={statusId} className="ml-8 text-base text-loam-soft empty:hidden" role="status">
        {current.isError
          ? 'Your choice could not be loaded. Reload the page to try again.'
          : save.isError
            ? `That was not saved: ${save.error.message}`
            : save.isSuccess
              ? save.data.on
                ? onText
                : offText
              : ''}
      </p>
    </div>
  );
}

const minutes = (n: number) => (n === 60 ? 'an hour' : `${n} minutes`);

/** `staff`: the mentors' two choices; `own`: the reply mail about one's own cases. */
export function MailSettings({ show }: { show: ReadonlyArray<'staff' | 'own'> }) {
  const headingId = useId();
  return (
    <Card id={MAIL_SETTINGS_ANCHOR} role="group" aria-labelledby={headingId} className="flex scroll-mt-24 flex-col gap-3 bg-rice">
      <h2 id={headingId} className="text-xl font-extrabold">
        E-mails to you
      </h2>
      {show.includes('own') && (
        <ChoiceBox
          choice="reply-mail"
          label={
            <>
              <span className="font-bold">E-mail me when a mentor replies</span> on a case of mine and I do not have it open. At most one e-mail a case every{' '}
              {minutes(REPLY_MAIL_WINDOW_MINUTES)}.
            </>
          }
          onText="Saved: you will hear when a mentor replies."
          offText="Saved: no e-mails when a mentor replies. Your batch shelf still shows what is new."
        />
      )}
      {show.includes('staff') && (
        <>
          <ChoiceBox
            choice="grower-wrote-mail"
            label={
              <>
                <span className="font-bold">E-mail me when a grower writes</span> on a case I hold and I have not read it within {minutes(GROWER_WROTE_MAIL_MINUTES)}. One
                e-mail a case until I have read it.
              </>
            }
            onText="Saved: you will hear when a grower writes."
            offText="Saved: no e-mails when a grower writes. The rounds still show what is new."
          />
          <ChoiceBox
            choice="urgent-mail"
            label={
              <>
                <span className="font-bold">E-mail about urgent cases</span>: when a case with high urgency has waited {minutes(URGENT_WAIT_MINUTES)} and no mentor has taken
                it yet. One e-mail for each such case.
              </>
            }
            onText="Saved: you will get the urgent-case e-mails."
            offText="Saved: no more urgent-case e-mails."
          />
        </>
      )}
    </Card>
  );
}
