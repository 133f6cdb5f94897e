import type { ScreenPath } from '../screens';

const PATHS: Record<ScreenPath, string> = {
  '/overview': 'M3.5 3.5h5v5h-5zM11.5 3.5h5v5h-5zM3.5 11.5h5v5h-5zM11.5 11.5h5v5h-5z',
  '/quotes': 'M6 3h6l4 4v10H6zM12 3v4h4M8.5 10.5h5M8.5 13.5h5',
  '/jobs': 'M7 3.5h6v2.5H7zM7 4.75H4.5v12h11v-12H13M7.5 11l2 2 3.5-4',
};

export function NavIcon({ screen }: { screen: ScreenPath }) {
  return (
    <svg viewBox="0 0 20 20" className="size-5 shrink-0" aria-hidden="true">
      <path d={PATHS[screen]} fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
