/** "0.50 : 1 sugar to culture" — sugar first, as the check's notes write it. */
export function ratioText(ratio: number): string {
  return `${ratio.toFixed(2)} : 1 sugar to culture`;
}

/** The usual rule in words: "equal weights" for 1, otherwise the ratio. */
export function targetText(targetRatio: number | null): string {
  if (targetRatio === null) return 'no sugar rule for this stage';
  return targetRatio === 1 ? 'equal weights (1.00 : 1)' : `${targetRatio.toFixed(2)} : 1`;
}
