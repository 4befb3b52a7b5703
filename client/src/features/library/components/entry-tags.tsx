import { STAGES, SYMPTOMS, labelOf } from '@shared/vocabulary';

/** The stages and signs an entry is about, as chips; a guide about everything says so briefly. */
export function EntryTags({ stages: allStages, symptoms: allSymptoms, limit }: { stages: readonly string[]; symptoms: readonly string[]; limit?: number }) {
  if (!allStages.length && !allSymptoms.length) return null;
  const manyStages = limit !== undefined && allStages.length > 4;
  const stages = manyStages ? [] : allStages;
  const symptoms = limit !== undefined ? allSymptoms.slice(0, limit) : allSymptoms;
  const more = allSymptoms.length - symptoms.length;
  return (
    <ul className="flex flex-wrap gap-1.5" aria-label="Stages and signs">
      {manyStages && <li className="rounded-full border border-loam-soft bg-rice px-2.5 py-0.5 text-sm font-bold">{allStages.length} stages</li>}
      {stages.map((s) => (
        <li key={s} className="rounded-full border border-loam-soft bg-rice px-2.5 py-0.5 text-sm font-bold">
          {s === 'other' ? labelOf(STAGES, s) : s}
        </li>
      ))}
      {symptoms.map((s) => (
        <li key={s} className="rounded-full border border-moss bg-moss-mist px-2.5 py-0.5 text-sm font-semibold text-moss-deep">
          {labelOf(SYMPTOMS, s)}
        </li>
      ))}
      {more > 0 && <li className="px-1 py-0.5 text-sm text-loam-soft">and {more} more</li>}
    </ul>
  );
}
