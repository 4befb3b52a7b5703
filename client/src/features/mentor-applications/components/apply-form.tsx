import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { EXPERIENCE_MAX, EXPERIENCE_MIN, mentorApplicationSchema, type MentorApplication } from '@shared/steward-schemas';
import { STAGES, type StageId } from '@shared/vocabulary';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { cx } from '../../../components/ui/cx';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { TextAreaField } from '../../steward/components/form-controls';
import { useApplyToMentor } from '../api/apply-to-mentor';

export function ApplyForm({ onApplied }: { onApplied: (application: MentorApplication) => void }) {
  const apply = useApplyToMentor();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm({
    resolver: zodResolver(mentorApplicationSchema),
    defaultValues: { experience: '', stages: [] as StageId[], region: '' },
  });
  const { errors } = form.formState;
  const experienceLength = form.watch('experience')?.trim().length ?? 0;

  const onSubmit = form.handleSubmit((values) => {
    setFailure(null);
    apply.mutate(values, {
      onSuccess: onApplied,
      onError: (error) => {
        if (isApiError(error, 409)) setFailure(error.message);
        else if (!applyFieldErrors(error, form.setError, ['experience', 'stages', 'region'])) setFailure(error.message);
      },
    });
  });

  const stagesError = errors.stages?.message ?? (Array.isArray(errors.stages) ? errors.stages.find(Boolean)?.message : undefined);

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6">
      <FormAlert title="Your application was not sent" message={failure} />

      <fieldset aria-describedby={stagesError ? 'apply-stages-error' : 'apply-stages-hint'} aria-invalid={stagesError ? true : undefined}>
        <legend className="font-bold">Stages you know well</legend>
        <p id="apply-stages-hint" className="text-base text-loam-soft">
          Choose the ones you have made several times and could help someone rescue.
        </p>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          {STAGES.map((stage) => (
            <label key={stage.id} className="flex min-h-11 cursor-pointer items-center gap-3 rounded-soft border border-line bg-rice px-3 py-2">
              <input type="checkbox" value={stage.id} className="size-5 accent-moss" {...form.register('stages')} />
              <span>{stage.label}</span>
            </label>
          ))}
        </div>
        {stagesError && (
          <p id="apply-stages-error" className="mt-1 font-semibold text-ember">
            {stagesError}
          </p>
        )}
      </fieldset>

      <div>
        <TextAreaField
          label="Your experience"
          hint={`What you have made, for how long, and what you have seen go wrong and brought back. At least ${EXPERIENCE_MIN} characters.`}
          rows={7}
          maxLength={EXPERIENCE_MAX}
          error={errors.experience?.message}
          {...form.register('experience')}
        />
        <p className={cx('mt-1 text-sm', experienceLength < EXPERIENCE_MIN ? 'text-loam-soft' : 'text-moss-deep')}>
          {experienceLength} of at least {EXPERIENCE_MIN} characters
        </p>
      </div>

      <TextField
        label="Where you grow"
        hint="Roughly — a valley, a village, a climate. Mentors near a grower know their weather."
        autoComplete="off"
        error={errors.region?.message}
        {...form.register('region')}
      />

      <Button type="submit" disabled={apply.isPending} className="self-start">
        {apply.isPending ? 'Sending…' : 'Send my application'}
      </Button>
    </form>
  );
}
