import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { OUTCOMES, recoveryReportSchema, type ClosingState, type Outcome } from '@shared/closing-schemas';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { FormAlert } from '../../../components/ui/form-alert';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { TextAreaField } from '../../batch-check/components/form-fields';
import { PhotoPicker } from '../../cases/components/photo-picker';
import { usePhotoDrafts } from '../../cases/hooks/use-photo-drafts';
import { useFileRecoveryReport } from '../api/file-recovery-report';
import { uploadRecoveryPhoto } from '../api/upload-recovery-photo';
import { StarRating } from './star-rating';

const formSchema = recoveryReportSchema.omit({ photoIds: true });
type FormInput = z.input<typeof formSchema>;
type FormValues = z.output<typeof formSchema>;

const OUTCOME_CHOICES: Record<Outcome, { title: string; text: string }> = {
  recovered: { title: 'Recovered', text: 'It is healthy again and I can use it.' },
  partly: { title: 'Partly', text: 'Some of it came back; some had to go.' },
  lost: { title: 'Lost', text: 'It had to be thrown away.' },
};

/** The grower's answer: how the batch is, stars for the advice, a comment, a photo, and consent. */
export function RecoveryReportForm({ state }: { state: ClosingState }) {
  const report = useFileRecoveryReport(state.caseId);
  const photos = usePhotoDrafts({ limit: 3 });
  const [failure, setFailure] = useState<string | null>(null);
  const [sending, setSending] = useState<string | null>(null);
  const form = useForm<FormInput, unknown, FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { outcome: undefined, stars: undefined, comment: '', consentToPublish: false, consentPhotos: false },
  });
  const { errors } = form.formState;
  const consent = form.watch('consentToPublish');
  const outcome = form.watch('outcome');

  const onSubmit = form.handleSubmit(async (values) => {
    setFailure(null);
    const photoIds: number[] = [];
    const ready = photos.drafts.filter((d) => d.blob && d.status !== 'sent');
    try {
      for (const [i, draft] of ready.entries()) {
        setSending(ready.length === 1 ? 'Sending the photo…' : `Sending photo ${i + 1} of ${ready.length}…`);
        photoIds.push(await uploadRecoveryPhoto(state.caseId, draft.blob!, draft.name));
      }
    } catch (error) {
      setSending(null);
      setFailure(isApiError(error) ? `The photo could not be sent: ${error.message}` : 'The photo could not be sent.');
      return;
    }
    setSending(null);
    report.mutate(
      { ...values, consentPhotos: values.consentToPublish && values.consentPhotos, photoIds },
      {
        // The page turns into its thank-you; focus goes to the top of the page's content (the
        // skip link's target) rather than being lost with the button that sent the report.
        onSuccess: () => document.getElementById('main')?.focus(),
        onError: (error) => {
          if (!applyFieldErrors(error, form.setError, ['outcome', 'stars', 'comment'])) setFailure(error.message);
        },
      },
    );
  });
  const busy = report.isPending || sending !== null || photos.preparing;

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6">
      <FormAlert title="The report was not sent" message={failure} />

      <fieldset aria-describedby={errors.outcome ? 'outcome-error' : undefined} className="flex flex-col gap-2">
        <legend className="text-lg font-bold">How is the batch now?</legend>
        <div className="grid gap-2 sm:grid-cols-3">
          {OUTCOMES.map((value) => (
            <label
              key={value}
              className={cx(
                'flex min-h-11 cursor-pointer items-start gap-3 rounded-soft border-2 p-3 has-focus-visible:outline-3 has-focus-visible:outline-loam',
                outcome === value ? 'border-moss-deep bg-moss-mist' : 'border-line bg-rice',
              )}
            >
              <input type="radio" value={value} className="mt-1 size-5 accent-moss-deep" {...form.register('outcome')} />
              <span>
                <span className="block font-extrabold">{OUTCOME_CHOICES[value].title}</span>
                <span className="block text-base text-loam-soft">{OUTCOME_CHOICES[value].text}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.outcome && (
          <p id="outcome-error" className="font-semibold text-ember">
            {errors.outcome.message}
          </p>
        )}
      </fieldset>

      {outcome === 'lost' && (
        <p className="rounded-soft border-l-8 border-ember bg-ember-mist px-4 py-3">
          Throwing a spoiled batch out is the right call. Wear a mask, bag it sealed, wash your hands and scrub the container before you start
          again.
        </p>
      )}

      <Controller
        control={form.control}
        name="stars"
        render={({ field, fieldState }) => (
          <StarRating legend="How helpful was the advice?" value={field.value as number | undefined} onChange={field.onChange} error={fieldState.error?.message} />
        )}
      />

      <TextAreaField label="Anything to add? (optional)" hint="What you saw, what you did, what you would do next time." rows={4} error={errors.comment?.message} {...form.register('comment')} />

      <PhotoPicker photos={photos} label="A photo of the batch now (optional)" hint="Up to 3 photos. They are made lighter before sending." disabled={busy} />

      <div className="flex flex-col gap-3 rounded-soft border border-line bg-rice-deep p-4">
        <label className="flex items-start gap-3">
          <input type="checkbox" className="mt-1 size-5 accent-moss-deep" {...form.register('consentToPublish')} />
          <span>
            <span className="font-bold">Share this case in the Field Library as a field note</span>
            <span className="block text-base text-loam-soft">
              {state.askToPublish ? 'Your mentor thinks other growers could learn from it. ' : ''}
              It is shared without your name, your e-mail address or where the batch sits, and you can stop sharing it at any time.
            </span>
          </span>
        </label>
        <label className={cx('flex items-start gap-3 pl-8', !consent && 'opacity-60')}>
          <input type="checkbox" className="mt-1 size-5 accent-moss-deep" disabled={!consent} {...form.register('consentPhotos')} />
          <span>Include my photos in the field note</span>
        </label>
      </div>

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={busy}>
          {report.isPending ? 'Sending…' : 'Send the report'}
        </Button>
        {sending && <span className="text-loam-soft">{sending}</span>}
        {photos.preparing && !sending && <span className="text-loam-soft">Getting the photo ready…</span>}
      </div>
    </form>
  );
}
