import type { ScreenPath } from '../screens';

const PATHS: Record<ScreenPath, string> = {
  '/overview': 'M3.5 3.5h5v5h-5zM11.5 3.5h5v5h-5zM3.5 11.5h5v5h-5zM11.5 11.5h5v5h-5z',
  '/activity': 'M10 3.5a6.5 6.5 0 1 0 0 13 6.5 6.5 0 0 0 0-13zM10 6.5V10l2.5 2',
  '/figures': 'M3.5 16.5h13M5.5 16.5v-5M9.5 16.5v-9M13.5 16.5v-7M5.5 8.5l4-4 4 3 3-3',
  '/quotes': 'M6 3h6l4 4v10H6zM12 3v4h4M8.5 10.5h5M8.5 13.5h5',
  '/customers': 'M7.5 9a2.75 2.75 0 1 0 0-5.5 2.75 2.75 0 0 0 0 5.5zM2.5 16.5c.4-2.9 2.4-4.75 5-4.75s4.6 1.85 5 4.75M13 4.25a2.5 2.5 0 0 1 0 4.5M14.5 11.9c1.6.6 2.7 2.2 3 4.6',
  '/catalogue': 'M4 4.5h5.5v5.5H4zM10.5 4.5H16v5.5h-5.5zM4 11h5.5v5H4zM10.5 11H16v5h-5.5zM6.75 6.5v1.5M13.25 13v1.5',
  '/jobs': 'M7 3.5h6v2.5H7zM7 4.75H4.5v12h11v-12H13M7.5 11l2 2 3.5-4',
  '/settings': 'M10 7.25a2.75 2.75 0 1 0 0 5.5 2.75 2.75 0 0 0 0-5.5zM10 2.75v2M10 15.25v2M2.75 10h2M15.25 10h2M4.9 4.9l1.4 1.4M13.7 13.7l1.4 1.4M4.9 15.1l1.4-1.4M13.7 6.3l1.4-1.4',
};

export function NavIcon({ screen }: { screen: ScreenPath }) {
  return (
    <svg viewBox="0 0 20 20" className="size-5 shrink-0" aria-hidden="true">
      <path d={PATHS[screen]} fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
