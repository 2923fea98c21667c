/** Amberline's mark: a low deck carrying a wide load, in amber. */
export function BrandMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
      <rect width="32" height="32" rx="6" fill="#1e293b" />
      <path d="M5 22h22v3H5z" fill="#f59e0b" />
      <path d="M8 19l6-10h4l6 10z" fill="#fbbf24" />
    </svg>
  );
}
