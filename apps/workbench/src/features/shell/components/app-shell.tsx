import { ROLE_LABELS } from '@gloaming/contracts';
import { Navigate, NavLink, Outlet, useLocation, useNavigation } from 'react-router-dom';
import { Wordmark } from '../../../components/ui/brand-mark';
import { useCurrentUser } from '../../session/api/get-session';
import { screensFor } from '../screens';
import { NavIcon } from './nav-icons';
import { UserMenu } from './user-menu';

/** The signed-in frame: skip link, sidebar with the firm, navigation for the role and the user menu. */
export function AppShell() {
  const { data: user } = useCurrentUser();
  const location = useLocation();
  const navigation = useNavigation();

  if (!user) {
    // The session ended while the page was open (signed out elsewhere, or it expired).
    const next = encodeURIComponent(`${location.pathname}${location.search}`);
    return <Navigate to={`/sign-in?next=${next}`} replace />;
  }

  return (
    <div className="min-h-screen bg-canvas lg:grid lg:grid-cols-[var(--spacing-sidebar)_minmax(0,1fr)]">
      <a
        href="#main"
        className="sr-only z-50 rounded-control bg-accent px-4 py-2 font-semibold text-accent-ink focus:not-sr-only focus:fixed focus:px-4 focus:py-2 focus:top-3 focus:left-3"
      >
        Skip to main content
      </a>
      {navigation.state === 'loading' ? (
        <div role="progressbar" aria-label="Loading" className="fixed inset-x-0 top-0 z-40 h-0.5 animate-pulse bg-accent" />
      ) : null}
      {/* Some screens are downloaded the first time they open: say so when that takes a moment. */}
      <p role="status" className="pointer-events-none fixed top-3 right-4 z-40">
        {navigation.state === 'loading' ? (
          <span className="block rounded-pill bg-dusk-900 px-3.5 py-1.5 text-caption font-medium text-dusk-100 shadow-raised appear-after-pause">Opening…</span>
        ) : null}
      </p>
      <aside className="on-dark flex flex-col bg-dusk-900 px-4 py-6 text-dusk-100 lg:sticky lg:top-0 lg:h-screen">
        <div className="px-2.5">
          <Wordmark tone="light" />
        </div>
        <div className="mt-8 rounded-card bg-dusk-800/70 px-3.5 py-3 ring-1 ring-dusk-700">
          <p className="text-micro font-semibold tracking-wide text-dusk-300 uppercase">Firm</p>
          <p className="mt-0.5 truncate font-semibold text-white" data-testid="firm-name">
            {user.organization.name}
          </p>
          <p className="text-caption text-dusk-200">Signed in as {ROLE_LABELS[user.role].toLowerCase()}</p>
        </div>
        <nav aria-label="Main" className="mt-8 flex-1">
          <ul className="flex flex-col gap-1">
            {screensFor(user.role).map((screen) => (
              <li key={screen.path}>
                <NavLink
                  to={screen.path}
                  className={({ isActive }) =>
                    `flex items-center gap-3 rounded-control px-2.5 py-2 font-medium transition-colors ${
                      isActive
                        ? 'bg-dusk-800 text-white shadow-[inset_3px_0_0_var(--color-lamp-400)]'
                        : 'text-dusk-200 hover:bg-dusk-800/60 hover:text-white'
                    }`
                  }
                >
                  <NavIcon screen={screen.path} />
                  {screen.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="mt-8 border-t border-dusk-700 pt-4">
          <UserMenu user={user} />
        </div>
      </aside>
      <main id="main" tabIndex={-1} className="px-6 py-10 outline-none sm:px-10 lg:px-14">
        <div className="mx-auto max-w-6xl">
          <Outlet />
        </div>
      </main>
    </div>
  );
}
