// For a member who has not yet opened the confirmation link: the check-in e-mails and the
// mentor's replies go to that address, so it is worth asking, with a way to get a new link.
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { useUser } from '../api/get-me';
import { useResendVerification } from '../api/resend-verification';

export function ConfirmEmailNotice({ className, afterFailedLink = false }: { className?: string; afterFailedLink?: boolean }) {
  const me = useUser().data;
  const resend = useResendVerification();
  if (!me || me.emailVerified) return null;

  return (
    <Alert tone="info" title={afterFailedLink ? 'Ask for a new link' : 'Please confirm your e-mail address'} className={className}>
      <p>
        {afterFailedLink ? 'We can send a fresh link to ' : 'We sent a link to '}
        <span className="font-bold">{me.email}</span>
        {afterFailedLink ? '.' : ' when you joined.'} The check-ins about your batches and your mentor’s replies go to this address, so it is worth
        making sure it reaches you.
      </p>
      {resend.isSuccess ? (
        <p className="mt-2 font-bold" role="status">
          A new link is on its way to {me.email}. It works for 48 hours.
        </p>
      ) : (
        <>
          {resend.isError && (
            <p className="mt-2 font-bold" role="alert">
              {resend.error.message}
            </p>
          )}
          <Button variant="secondary" className="mt-3" onClick={() => resend.mutate()} disabled={resend.isPending}>
            {resend.isPending ? 'Sending…' : 'Send me a new link'}
          </Button>
        </>
      )}
    </Alert>
  );
}
