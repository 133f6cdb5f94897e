import type { ReactNode } from 'react';

/** A screen: a route's component, which takes no props. */
type Screen = () => ReactNode;

/**
 * A screen whose code could not be downloaded: the connection dropped, or Gloaming was updated
 * since this page was loaded and the old file is gone. Reloading the page fixes both.
 */
export class ScreenDownloadError extends Error {
  constructor(options: { cause: unknown }) {
    super('The code for this screen could not be downloaded.', options);
    this.name = 'ScreenDownloadError';
  }
}

export const isScreenDownloadError = (error: unknown): error is ScreenDownloadError => error instanceof ScreenDownloadError;

/**
 * A route's screen, downloaded the first time the route opens (React Router's lazy route
 * properties), so the first load carries only the screens people start on:
 *
 *   lazy: { Component: lazyScreen(() => import('../features/figures/components/figures-page'), (m) => m.FiguresPage) }
 *
 * The route's loader stays in the router, so its data is fetched while the code downloads.
 * When the download fails, the screen's place is taken by a component that throws a
 * ScreenDownloadError, so the route's error boundary (RouteError) explains it with a reload
 * button. (A rejected lazy Component only reaches the error boundary when the route also has
 * a loader; a loader-less route would show an empty page.)
 */
export function lazyScreen<M>(load: () => Promise<M>, pick: (module: M) => Screen): () => Promise<Screen> {
  return async () => {
    let module: M;
    try {
      module = await load();
    } catch (cause) {
      const error = new ScreenDownloadError({ cause });
      return function ScreenNotDownloaded(): never {
        throw error;
      };
    }
    return pick(module);
  };
}
