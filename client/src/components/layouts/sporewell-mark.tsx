// The same drawing as public/favicon.svg: a jar of living culture with a sprout on the lid.
export function SporewellMark({ className }: { className?: string }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 64 64" className={className}>
      <rect width="64" height="64" rx="14" fill="#2d5220" />
      <path d="M32 14c0-5 4-8 9-8 0 5-4 8-9 8z" fill="#b9d59f" />
      <rect x="20" y="14" width="24" height="6" rx="2" fill="#e4cfa4" />
      <path d="M18 24c0-2 2-4 4-4h20c2 0 4 2 4 4v26c0 4-3 8-8 8H26c-5 0-8-4-8-8z" fill="#faf6ee" />
      <circle cx="27" cy="36" r="3.5" fill="#3d6b2c" />
      <circle cx="37" cy="33" r="2.5" fill="#3d6b2c" />
      <circle cx="35" cy="44" r="4" fill="#3d6b2c" />
      <circle cx="26" cy="47" r="2" fill="#3d6b2c" />
    </svg>
  );
}
