/** A person's initials in a circle; decorative, the name is always written beside it. */
export function Initials({ name, tone = 'light' }: { name: string; tone?: 'light' | 'dark' }) {
  const letters = name
    .split(/\s+/)
    .filter(Boolean)
    .map((part) => part[0]?.toUpperCase() ?? '')
    .slice(0, 2)
    .join('');
  return (
    <span
      aria-hidden="true"
      className={`inline-flex size-9 shrink-0 items-center justify-center rounded-pill text-caption font-semibold ${
        tone === 'dark' ? 'bg-lamp-400 text-dusk-950' : 'bg-dusk-100 text-dusk-700'
      }`}
    >
      {letters}
    </span>
  );
}
