import type { ComponentType } from 'react';

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
 * A failed download becomes a ScreenDownloadError, which RouteError explains, with a reload button.
 */
export function lazyScreen<M>(load: () => Promise<M>, pick: (module: M) => ComponentType): () => Promise<ComponentType> {
  return async () => {
    let module: M;
    try {
      module = await load();
    } catch (cause) {
      throw new ScreenDownloadError({ cause });
    }
    return pick(module);
  };
}
