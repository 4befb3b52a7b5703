// On a mentor's own profile: the few lines growers read about them (what they make, where they
// grow, what they know well), written and changed by the mentor alone. Shown as plain text.
import { useEffect, useRef, useState } from 'react';
import { ABOUT_MAX } from '@shared/steward-schemas';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-client';
import { TextAreaField } from '../../steward/components/form-controls';
import { useSetAbout } from '../api/set-about';

export function AboutEditor({ mentorId, about }: { mentorId: number; about: string | null }) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(about ?? '');
  const save = useSetAbout(mentorId);
  const fieldError = isApiError(save.error, 400) ? save.error.fields?.about : undefined;
  // Back from the form (saved or not), the keyboard lands on the button that opened it.
  const opener = useRef<HTMLButtonElement>(null);
  const wasEditing = useRef(false);
  useEffect(() => {
    if (!editing && wasEditing.current) opener.current?.focus();
    wasEditing.current = editing;
  }, [editing]);

  if (!editing) {
    return (
      <div className="mb-8 flex flex-col items-start gap-2">
        {save.isSuccess && (
          <p role="status" className="text-base font-bold text-moss-deep">
            {save.data.about ? 'Saved. Growers see this on your profile.' : 'Saved. Your profile shows no words about you now.'}
          </p>
        )}
        <Button
          ref={opener}
          variant="secondary"
          onClick={() => {
            setText(about ?? '');
            save.reset();
            setEditing(true);
          }}
        >
          {about ? 'Change what growers read about you' : 'Write a few lines about yourself'}
        </Button>
      </div>
    );
  }

  return (
    <form
      className="mb-8 flex max-w-2xl flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate(text, { onSuccess: () => setEditing(false) });
      }}
    >
      <TextAreaField
        label="About you"
        hint={`What you make and where, and what you know well. Growers read it on this page. Leave out phone numbers and addresses. At most ${ABOUT_MAX} characters.`}
        value={text}
        maxLength={ABOUT_MAX}
        rows={4}
        autoFocus
        onChange={(e) => setText(e.target.value)}
        error={fieldError}
      />
      {save.isError && !fieldError && (
        <Alert tone="danger" title="That was not saved">
          {save.error.message}
        </Alert>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save'}
        </Button>
        <Button variant="quiet" type="button" onClick={() => setEditing(false)} disabled={save.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
