import { Wordmark } from '../components/ui/brand-mark';

/**
 * Shown while the first screen of a visit opens: the session check, the screen's data and, for
 * screens downloaded on demand, its code. Later navigations keep the current screen and show
 * the shell's loading bar instead.
 */
export function AppLoading() {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center gap-6 bg-canvas px-6 text-center">
      <Wordmark />
      <p role="status" className="text-body text-ink-muted appear-after-pause">
        Opening Gloaming…
      </p>
    </div>
  );
}
