import { URGENCY_WEIGHTS } from '@shared/urgency';
import { SYMPTOMS, type SymptomId } from '@shared/vocabulary';

/** A symptom short enough for a table cell, and clear without its group heading. */
export function symptomShort(id: SymptomId): string {
  const item = SYMPTOMS.find((s) => s.id === id);
  if (!item) return id;
  if (id === 'smell-none') return 'No smell';
  if (item.group === 'smell') return `${item.label} smell`;
  if (item.group === 'colour') return `${item.label} colour`;
  return item.label;
}

/** Weightiest first, so the sign that worries a mentor most is the one they read first. */
export function bySeriousness(symptoms: readonly SymptomId[]): SymptomId[] {
  return [...symptoms].sort((a, b) => (URGENCY_WEIGHTS.symptoms[b] ?? 0) - (URGENCY_WEIGHTS.symptoms[a] ?? 0));
}
