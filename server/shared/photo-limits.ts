// What one photo upload may hold. Apart from case-schemas.ts so the client's upload code can read
// the limits without loading the schema library.
export const PHOTO_LIMITS = {
  maxFiles: 6,
  maxFileBytes: 10 * 1024 * 1024,
  maxPixels: 40_000_000,
  longSide: 2048,
  thumbLongSide: 400,
  acceptedTypes: ['image/jpeg', 'image/png', 'image/webp'] as const,
} as const;
