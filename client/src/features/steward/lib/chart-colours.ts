// The chart colours are the @theme tokens of styles/app.css (repeated here because SVG
// attributes take no CSS variables), and lighter mixes of them with rice, the page colour.
import type { StageId } from '@shared/vocabulary';

export const TOKENS = {
  rice: '#faf6ee',
  riceDeep: '#f0e8d8',
  loam: '#2b2118',
  loamSoft: '#5c4b3b',
  line: '#cbbfa8',
  moss: '#3d6b2c',
  mossDeep: '#2d5220',
  clay: '#a0521a',
  clayDeep: '#7a3d10',
  ember: '#8f2418',
} as const;

/** `share` of `colour`, the rest rice. */
export function withRice(colour: string, share: number): string {
  const channel = (hex: string, i: number) => parseInt(hex.slice(1 + i * 2, 3 + i * 2), 16);
  return `#${[0, 1, 2]
    .map((i) => Math.round(channel(colour, i) * share + channel(TOKENS.rice, i) * (1 - share)).toString(16).padStart(2, '0'))
    .join('')}`;
}

// Neighbouring stages alternate between a full token and a light mix, so stacked bars stay apart.
export const STAGE_COLOURS: Record<StageId, string> = {
  IMO1: TOKENS.moss,
  IMO2: withRice(TOKENS.moss, 0.5),
  IMO3: TOKENS.loamSoft,
  IMO4: withRice(TOKENS.loamSoft, 0.5),
  FPJ: TOKENS.clay,
  FFJ: withRice(TOKENS.clay, 0.5),
  LAB: TOKENS.ember,
  OHN: withRice(TOKENS.ember, 0.5),
  WCA: TOKENS.loam,
  WCS: TOKENS.line,
  other: TOKENS.clayDeep,
};
