import type { ReactNode } from 'react';
import { Wordmark } from '../../../components/ui/brand-mark';
import { DuskGarden } from './dusk-garden';

/** The frame around the signed-out pages: picture and statement on the left, the task on the right. */
export function AuthFrame({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <div className="grid min-h-screen bg-canvas lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <aside className="on-dark relative hidden overflow-hidden bg-dusk-900 lg:block">
        <DuskGarden className="absolute inset-0 size-full" />
        <div className="absolute inset-x-0 bottom-0 h-2/5 bg-linear-to-t from-dusk-950 via-dusk-950/80 to-transparent" />
        <div className="relative flex h-full flex-col justify-between p-12">
          <Wordmark tone="light" />
          <div className="max-w-sm pb-4">
            <p className="text-title font-semibold tracking-tight text-white">
              From survey to switch-on, every circuit accounted for.
            </p>
            <p className="mt-3 text-body text-dusk-100">
              Design low-voltage garden lighting, quote it with confidence and hand installers a pick list they can trust.
            </p>
          </div>
        </div>
      </aside>
      <main id="main" className="flex items-center justify-center px-6 py-12 sm:px-12">
        <div className="w-full max-w-[26rem]">
          <div className="mb-10 lg:hidden">
            <Wordmark />
          </div>
          <h1 className="text-title font-semibold tracking-tight text-ink">{title}</h1>
          {intro ? <div className="mt-2 text-body text-ink-muted">{intro}</div> : null}
          <div className="mt-8">{children}</div>
        </div>
      </main>
    </div>
  );
}
