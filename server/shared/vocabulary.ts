// The trade's vocabulary and our own short lists. Ids are what the API accepts and stores;
// labels are what a grower reads. Plain data that imports nothing, so a page that only shows
// labels (the Field Library) does not load zod; the schemas are in vocabulary-schemas.ts.

export interface VocabularyItem<Id extends string = string> {
  id: Id;
  label: string;
  group?: string;
}

export const STAGES = [
  { id: 'IMO1', label: 'IMO1 — rice culture from the woods' },
  { id: 'IMO2', label: 'IMO2 — culture kept with sugar' },
  { id: 'IMO3', label: 'IMO3 — culture spread on bran' },
  { id: 'IMO4', label: 'IMO4 — culture mixed with soil' },
  { id: 'FPJ', label: 'FPJ — fermented plant juice' },
  { id: 'FFJ', label: 'FFJ — fermented fruit juice' },
  { id: 'LAB', label: 'LAB — lactic acid bacteria serum' },
  { id: 'OHN', label: 'OHN — oriental herbal nutrient' },
  { id: 'WCA', label: 'WCA — water-soluble calcium' },
  { id: 'WCS', label: 'WCS — water-soluble calcium phosphate' },
  { id: 'other', label: 'Something else' },
] as const satisfies readonly VocabularyItem[];

export type StageId = (typeof STAGES)[number]['id'];
export const STAGE_IDS = STAGES.map((s) => s.id) as [StageId, ...StageId[]];

export const SYMPTOM_GROUPS = [
  { id: 'smell', label: 'Smell' },
  { id: 'colour', label: 'Colour' },
  { id: 'activity', label: 'Activity and texture' },
] as const;

export const SYMPTOMS = [
  { id: 'smell-sweet', label: 'Sweet', group: 'smell' },
  { id: 'smell-earthy', label: 'Earthy or mushroom', group: 'smell' },
  { id: 'smell-alcoholic', label: 'Alcoholic or yeasty', group: 'smell' },
  { id: 'smell-sour', label: 'Sour or vinegar', group: 'smell' },
  { id: 'smell-putrid', label: 'Putrid or rotten', group: 'smell' },
  { id: 'smell-ammonia', label: 'Ammonia', group: 'smell' },
  { id: 'smell-musty', label: 'Musty', group: 'smell' },
  { id: 'smell-none', label: 'No smell', group: 'smell' },
  { id: 'colour-white', label: 'White', group: 'colour' },
  { id: 'colour-light-grey', label: 'Light grey', group: 'colour' },
  { id: 'colour-dark-grey', label: 'Dark grey', group: 'colour' },
  { id: 'colour-yellow-orange', label: 'Yellow or orange', group: 'colour' },
  { id: 'colour-pink-red', label: 'Pink or red', group: 'colour' },
  { id: 'colour-bright-green', label: 'Bright green', group: 'colour' },
  { id: 'colour-blue-green', label: 'Blue-green', group: 'colour' },
  { id: 'colour-black', label: 'Black', group: 'colour' },
  { id: 'colour-brown', label: 'Brown', group: 'colour' },
  { id: 'bubbling', label: 'Bubbling or foaming', group: 'activity' },
  { id: 'slimy', label: 'Slimy', group: 'activity' },
  { id: 'free-liquid', label: 'Free liquid pooling', group: 'activity' },
  { id: 'wet-sloppy', label: 'Wet and sloppy', group: 'activity' },
  { id: 'dry-crusty', label: 'Dry or crusty', group: 'activity' },
  { id: 'clumped', label: 'Clumped', group: 'activity' },
  { id: 'fuzzy-growth', label: 'Fuzzy growth', group: 'activity' },
  { id: 'insects', label: 'Insects or larvae', group: 'activity' },
  { id: 'animal-damage', label: 'Animal damage', group: 'activity' },
] as const satisfies readonly VocabularyItem[];

export type SymptomId = (typeof SYMPTOMS)[number]['id'];
export const SYMPTOM_IDS = SYMPTOMS.map((s) => s.id) as [SymptomId, ...SymptomId[]];

// Our own short lists for closing a case (PRODUCT.md §6).
export const CAUSES = [
  { id: 'too-little-sugar', label: 'Too little sugar for the culture' },
  { id: 'too-wet', label: 'Too wet' },
  { id: 'too-dry', label: 'Too dry' },
  { id: 'too-warm', label: 'Too warm' },
  { id: 'too-cold', label: 'Too cold' },
  { id: 'poor-air', label: 'Not enough air, or sealed too tight' },
  { id: 'unwanted-microbes', label: 'Unwanted microbes took over' },
  { id: 'pests', label: 'Insects or animals got in' },
  { id: 'kept-too-long', label: 'Kept too long' },
  { id: 'normal-change', label: 'Nothing wrong: a normal change' },
  { id: 'unknown', label: 'Not sure' },
] as const satisfies readonly VocabularyItem[];
export type CauseId = (typeof CAUSES)[number]['id'];
export const CAUSE_IDS = CAUSES.map((c) => c.id) as [CauseId, ...CauseId[]];

export const REMEDIES = [
  { id: 'add-sugar', label: 'Mix in or top-dress more sugar' },
  { id: 'drain-liquid', label: 'Drain the free liquid' },
  { id: 'add-dry-matter', label: 'Mix in dry bran or dry material' },
  { id: 'add-water', label: 'Moisten it' },
  { id: 'move-cooler', label: 'Move it somewhere cooler or shaded' },
  { id: 'move-warmer', label: 'Move it somewhere warmer' },
  { id: 'change-cover', label: 'Change the cover so it breathes' },
  { id: 'remove-spoiled', label: 'Scoop out the spoiled part' },
  { id: 'protect-from-pests', label: 'Cover and protect it from pests' },
  { id: 'wait-and-watch', label: 'Leave it and watch' },
  { id: 'use-now', label: 'Use it now, diluted' },
  { id: 'discard-restart', label: 'Discard it and start again' },
] as const satisfies readonly VocabularyItem[];
export type RemedyId = (typeof REMEDIES)[number]['id'];
export const REMEDY_IDS = REMEDIES.map((r) => r.id) as [RemedyId, ...RemedyId[]];

export function labelOf(list: readonly VocabularyItem[], id: string): string {
  return list.find((item) => item.id === id)?.label ?? id;
}
