import type { ScreenPath } from '../screens';

const PATHS: Record<ScreenPath, string> = {
  '/overview': 'M3 10.5 10 4l7 6.5M5 9v7h3.5v-4h3v4H15V9',
  '/quotes': 'M6 3h6l4 4v10H6zM12 3v4h4M8.5 10.5h5M8.5 13.5h5',
  '/jobs': 'M3 16h14M5.5 16V9l4.5-3 4.5 3v7M8.5 16v-3.5h3V16',
};

export function NavIcon({ screen }: { screen: ScreenPath }) {
  return (
    <svg viewBox="0 0 20 20" className="size-5 shrink-0" aria-hidden="true">
      <path d={PATHS[screen]} fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
