// "Your account": the signed-in person's name, e-mail address and password, and for mentors and
// stewards the e-mails they get from the rounds.
import { Link } from 'react-router';
import { isStaffRole } from '@shared/case-status';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { useUser } from '../../../features/auth/api/get-me';
import { NameForm, PasswordForm } from '../../../features/auth/components/account-forms';
import { ConfirmEmailNotice } from '../../../features/auth/components/confirm-email-notice';
import { MailSettings } from '../../../features/rounds/components/mail-settings';
import { ROLE_LABELS } from '../../../lib/auth';

export default function AccountRoute() {
  const user = useUser().data;
  if (!user) return null;
  return (
    <ContentLayout title="Your account" lead={`${ROLE_LABELS[user.role]} on Sporewell, signed in as ${user.email}.`}>
      <div className="flex flex-col gap-10">
        <section aria-labelledby="account-name-heading" className="flex flex-col gap-3">
          <h2 id="account-name-heading" className="text-2xl font-extrabold">
            Name
          </h2>
          <NameForm key={user.id} user={user} />
          {isStaffRole(user.role) && (
            <p>
              What growers read about you is on <Link to={`/mentors/${user.id}`}>your track record</Link>.
            </p>
          )}
        </section>

        <section aria-labelledby="account-email-heading" className="flex flex-col gap-3">
          <h2 id="account-email-heading" className="text-2xl font-extrabold">
            E-mail address
          </h2>
          <p>
            <span className="font-bold">{user.email}</span>
            {user.emailVerified ? ' — confirmed. Check-ins about your batches and replies on your cases go here.' : ' — not confirmed yet.'}
          </p>
          <ConfirmEmailNotice />
        </section>

        <section aria-labelledby="account-password-heading" className="flex flex-col gap-3">
          <h2 id="account-password-heading" className="text-2xl font-extrabold">
            Password
          </h2>
          <PasswordForm />
          <p className="text-loam-soft">
            Forgotten it? <Link to="/forgot-password">Get a reset link by e-mail</Link>.
          </p>
        </section>

        <MailSettings show={isStaffRole(user.role) ? ['own', 'staff'] : ['own']} />
      </div>
    </ContentLayout>
  );
}
