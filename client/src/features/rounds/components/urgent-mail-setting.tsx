// On the rounds, below the list: whether this mentor is e-mailed when a high-urgency case has
// waited an hour with nobody on it. Saved as soon as the box changes; the urgent-case mail links
// back here to turn it off.
import { useId } from 'react';
import { URGENT_WAIT_MINUTES } from '@shared/urgency';
import { Card } from '../../../components/ui/card';
import { useSetUrgentMail, useUrgentMail } from '../api/urgent-mail';

export const URGENT_MAIL_ANCHOR = 'urgent-mail';

export function UrgentMailSetting() {
  const current = useUrgentMail();
  const save = useSetUrgentMail();
  const headingId = useId();
  const on = save.isPending ? save.variables : current.data?.on;

  return (
    <Card id={URGENT_MAIL_ANCHOR} role="group" aria-labelledby={headingId} className="bg-rice scroll-mt-24">
      <h2 id={headingId} className="text-xl font-extrabold">
        E-mail about urgent cases
      </h2>
      <label className="mt-2 flex min-h-11 cursor-pointer items-start gap-3">
        <input
          type="checkbox"
          className="mt-1 size-5 shrink-0 accent-moss"
          checked={on ?? false}
          disabled={current.isPending || save.isPending}
          onChange={(e) => save.mutate(e.target.checked)}
        />
        <span>
          E-mail me when a case with high urgency has waited {URGENT_WAIT_MINUTES === 60 ? 'an hour' : `${URGENT_WAIT_MINUTES} minutes`} and no mentor has taken it yet —
          one e-mail for each such case.
        </span>
      </label>
      <p className="mt-1 text-base text-loam-soft" role="status">
        {current.isError
          ? 'Your choice could not be loaded. Reload the page to try again.'
          : save.isError
            ? `That was not saved: ${save.error.message}`
            : save.isSuccess
              ? save.data.on
                ? 'Saved: you will get these e-mails.'
                : 'Saved: no more of these e-mails.'
              : ''}
      </p>
    </Card>
  );
}
