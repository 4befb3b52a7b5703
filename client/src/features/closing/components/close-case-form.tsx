import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { closeCaseSchema, DEFAULT_CHECK_IN_DAYS } from '@shared/closing-schemas';
import { CAUSES, REMEDIES } from '@shared/vocabulary';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { SelectField, TextAreaField } from '../../batch-check/components/form-fields';
import { useCloseCase } from '../api/close-case';

// The words to leave out are typed as one line, comma separated; the server takes a list.
const formSchema = closeCaseSchema.omit({ redactTerms: true, checkInDays: true }).extend({
  redactText: z.string().max(800, { error: 'Keep the words to leave out under 800 characters.' }),
});
type FormInput = z.input<typeof formSchema>;
type FormValues = z.output<typeof formSchema>;

const toOptions = (list: ReadonlyArray<{ id: string; label: string }>) => list.map((item) => ({ value: item.id, label: item.label }));

/** Cause, remedy, a summary in plain words, and whether to ask the grower to share it. */
export function CloseCaseForm({ caseId, onCancel }: { caseId: number; onCancel: () => void }) {
  const close = useCloseCase(caseId);
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<FormInput, unknown, FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { cause: undefined, causeNotes: '', remedy: undefined, remedyNotes: '', summary: '', askToPublish: true, redactText: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(({ redactText, ...values }) => {
    setFailure(null);
    const redactTerms = redactText
      .split(',')
      .map((t) => t.trim())
      .filter((t) => t.length >= 2);
    close.mutate(
      { ...values, redactTerms },
      {
        onError: (error) => {
          if (!applyFieldErrors(error, form.setError, ['cause', 'causeNotes', 'remedy', 'remedyNotes', 'summary'])) setFailure(error.message);
        },
      },
    );
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <FormAlert title="The case was not closed" message={failure} />
      <div className="grid gap-5 md:grid-cols-2">
        <div className="flex flex-col gap-3">
          {/* Opened from a button that goes away with it: the form takes focus at its first field. */}
          <SelectField
            label="Likely cause"
            placeholder="Choose the likely cause"
            options={toOptions(CAUSES)}
            error={errors.cause?.message}
            autoFocus
            {...form.register('cause')}
          />
          <TextAreaField label="About the cause (optional)" rows={3} error={errors.causeNotes?.message} {...form.register('causeNotes')} />
        </div>
        <div className="flex flex-col gap-3">
          <SelectField label="Remedy to try" placeholder="Choose the remedy" options={toOptions(REMEDIES)} error={errors.remedy?.message} {...form.register('remedy')} />
          <TextAreaField label="How to do it (optional)" rows={3} error={errors.remedyNotes?.message} {...form.register('remedyNotes')} />
        </div>
      </div>
      <TextAreaField
        label="Summary in plain words"
        hint="What was wrong and what to do, as you would tell a neighbour. This is what the grower and, if shared, the Field Library read first."
        rows={4}
        error={errors.summary?.message}
        {...form.register('summary')}
      />
      <div className="flex flex-col gap-3 rounded-soft border border-line bg-rice p-4">
        <label className="flex items-start gap-3">
          <input type="checkbox" className="mt-1 size-5 accent-moss-deep" {...form.register('askToPublish')} />
          <span>
            <span className="font-bold">Ask the grower to share this as a field note</span>
            <span className="block text-base text-loam-soft">Only with their consent, and without names, e-mail addresses or where the batch sits.</span>
          </span>
        </label>
        <TextField
          label="Words or places to leave out of the field note (optional)"
          hint="Separated by commas, e.g. the name of a farm or a lane."
          error={errors.redactText?.message}
          {...form.register('redactText')}
        />
      </div>
      <p className="text-loam-soft">
        The case moves to “Watching”. We will ask the grower how the batch does after {DEFAULT_CHECK_IN_DAYS.slice(0, -1).join(', ')} and{' '}
        {DEFAULT_CHECK_IN_DAYS.at(-1)} days, unless they answer first.
      </p>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={close.isPending}>
          {close.isPending ? 'Closing…' : 'Close and start watching'}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={close.isPending}>
          Not yet
        </Button>
      </div>
    </form>
  );
}
