/** Epsigma's mark: the Lennard-Jones well drawn as one stroke, the repulsive wall falling into the well. */
export function LogoMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
      <rect width="32" height="32" rx="7" fill="currentColor" />
      <path
        d="M7 4 C8.2 16 9.6 24.5 12.6 24.5 C15.6 24.5 17.5 18.4 27 17.2"
        fill="none"
        stroke="#d08a55"
        strokeWidth="2.6"
        strokeLinecap="round"
      />
    </svg>
  );
}
