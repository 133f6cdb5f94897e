/** A garden at dusk with path lights: the picture beside the sign-in forms. Decorative. */
export function DuskGarden({ className = '' }: { className?: string }) {
  const lights = [
    { x: 188, y: 640, s: 1.15 },
    { x: 372, y: 602, s: 0.95 },
    { x: 258, y: 560, s: 0.8 },
    { x: 356, y: 528, s: 0.68 },
    { x: 300, y: 503, s: 0.56 },
  ];
  return (
    <svg viewBox="0 0 640 800" preserveAspectRatio="xMidYMax slice" className={className} aria-hidden="true">
      <defs>
        <linearGradient id="dg-sky" x1="0" y1="0" x2="0" y2="1">
          <stop offset="0" stopColor="#0b1024" />
          <stop offset="0.45" stopColor="#1b2552" />
          <stop offset="0.72" stopColor="#36458a" />
          <stop offset="0.86" stopColor="#7a6aa6" />
          <stop offset="0.95" stopColor="#d98f6a" />
        </linearGradient>
        <radialGradient id="dg-pool" cx="50%" cy="50%" r="50%">
          <stop offset="0" stopColor="#ffd899" stopOpacity="0.75" />
          <stop offset="0.45" stopColor="#f5a83a" stopOpacity="0.28" />
          <stop offset="1" stopColor="#f5a83a" stopOpacity="0" />
        </radialGradient>
        <radialGradient id="dg-window" cx="50%" cy="50%" r="50%">
          <stop offset="0" stopColor="#ffc266" stopOpacity="0.5" />
          <stop offset="1" stopColor="#ffc266" stopOpacity="0" />
        </radialGradient>
        <linearGradient id="dg-path" x1="0" y1="0" x2="0" y2="1">
          <stop offset="0" stopColor="#27336b" />
          <stop offset="1" stopColor="#36458a" />
        </linearGradient>
      </defs>
      <rect width="640" height="800" fill="url(#dg-sky)" />
      {[
        [72, 84, 1.4],
        [166, 150, 1],
        [248, 62, 1.2],
        [410, 118, 1.5],
        [520, 70, 1],
        [584, 170, 1.2],
        [118, 248, 0.9],
        [470, 232, 1],
        [330, 190, 0.8],
        [36, 330, 1],
        [602, 300, 0.9],
      ].map(([cx, cy, r]) => (
        <circle key={`${cx}-${cy}`} cx={cx} cy={cy} r={r} fill="#e3e7f8" opacity="0.75" />
      ))}
      <circle cx="498" cy="214" r="26" fill="#f3f5fc" opacity="0.92" />
      <circle cx="510" cy="206" r="24" fill="#1b2552" opacity="0.9" />
      {/* far hedge line and house */}
      <path d="M0 520c60-18 120-30 170-22s90 6 130-6 110-20 170-10 110 12 170 4v120H0z" fill="#1b2552" />
      <path d="M404 470 470 420l66 50v56H404z" fill="#121a3a" />
      <rect x="422" y="484" width="22" height="24" rx="2" fill="#ffc266" opacity="0.9" />
      <rect x="494" y="484" width="22" height="24" rx="2" fill="#ffc266" opacity="0.65" />
      <circle cx="433" cy="496" r="40" fill="url(#dg-window)" />
      {/* trees */}
      <path d="M70 530c-30-10-40-60-10-86 8-40 60-46 78-14 34 0 46 46 22 70 6 26-30 44-90 30z" fill="#121a3a" />
      <path d="M560 540c-22-6-30-44-8-64 4-30 44-34 58-10 26 0 34 34 16 52 4 20-24 32-66 22z" fill="#121a3a" />
      {/* lawn */}
      <path d="M0 560c120-26 250-30 380-20s200 18 260 10v250H0z" fill="#121a3a" />
      {/* winding path */}
      <path
        d="M300 500c-20 10-40 18-30 32s70 18 80 34-80 28-120 46-70 48-70 78-40 60-60 110h230c-10-40-40-70-30-100s90-56 110-84-50-42-80-56-30-24 0-40z"
        fill="url(#dg-path)"
        opacity="0.9"
      />
      {lights.map(({ x, y, s }) => (
        <g key={`${x}-${y}`} transform={`translate(${x} ${y}) scale(${s})`}>
          <ellipse cx="0" cy="18" rx="70" ry="26" fill="url(#dg-pool)" />
          <rect x="-2.5" y="-26" width="5" height="44" rx="2" fill="#0b1024" />
          <path d="M-11 -26h22l-4-9h-14z" fill="#0b1024" />
          <rect x="-8" y="-26" width="16" height="5" rx="1.5" fill="#ffd899" />
          <circle cx="0" cy="-20" r="16" fill="url(#dg-window)" />
        </g>
      ))}
      <path d="M0 720c140-20 300-10 640 10v70H0z" fill="#0b1024" opacity="0.7" />
    </svg>
  );
}
