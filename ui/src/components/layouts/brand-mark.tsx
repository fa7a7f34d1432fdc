// Beamwright's mark: two terminals and the beam between them, waist in the middle.
export function BrandMark({ size = 24 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="7" fill="#123b46" />
      <path d="M5 16h4M23 16h4" stroke="#7fd6c8" strokeWidth="2.5" strokeLinecap="round" />
      <path d="M9 13.5Q16 16 23 11M9 18.5Q16 16 23 21" fill="none" stroke="#f2b84b" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}
