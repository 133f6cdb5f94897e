import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactElement } from 'react';
import { createMemoryRouter, Link, Outlet, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { isScreenDownloadError, lazyScreen } from '../src/app/lazy-screen';
import { RouteError } from '../src/app/route-error';

afterEach(cleanup);

/** A frame like the app's: a link to a screen downloaded on demand, the errors shown by RouteError. */
function appWith(load: () => Promise<{ Screen: () => ReactElement }>) {
  return createMemoryRouter(
    [
      {
        path: '/',
        element: (
          <>
            <Link to="/figures">Figures</Link>
            <Outlet />
          </>
        ),
        errorElement: <RouteError />,
        children: [{ path: 'figures', lazy: { Component: lazyScreen(load, (m) => m.Screen) } }],
      },
    ],
    { initialEntries: ['/'] },
  );
}

describe('screens downloaded on demand', () => {
  it('opens the screen once its code has arrived', async () => {
    const load = vi.fn(async () => ({ Screen: () => <h1>Figures</h1> }));
    render(<RouterProvider router={appWith(load)} />);
    expect(load).not.toHaveBeenCalled(); // nothing is fetched before the route opens
    await userEvent.click(screen.getByRole('link', { name: 'Figures' }));
    expect(await screen.findByRole('heading', { name: 'Figures' })).toBeTruthy();
    expect(load).toHaveBeenCalledTimes(1);
  });

  it('explains a failed download and offers a reload instead of a blank page', async () => {
    // what Chromium rejects a dynamic import with when the file cannot be fetched
    const failure = new TypeError('Failed to fetch dynamically imported module: /assets/figures-page-x1.js');
    render(<RouterProvider router={appWith(() => Promise.reject(failure))} />);
    await userEvent.click(screen.getByRole('link', { name: 'Figures' }));
    expect(await screen.findByRole('heading', { name: 'This page could not open' })).toBeTruthy();
    expect(screen.getByText(/This screen could not be downloaded/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Reload' })).toBeTruthy();
  });

  it('explains it on a route with a loader as well', async () => {
    const router = createMemoryRouter(
      [
        {
          path: '/',
          errorElement: <RouteError />,
          loader: () => null,
          lazy: { Component: lazyScreen(() => Promise.reject(new TypeError('Failed to fetch dynamically imported module')), () => () => null) },
        },
      ],
      { initialEntries: ['/'] },
    );
    render(<RouterProvider router={router} />);
    expect(await screen.findByText(/This screen could not be downloaded/)).toBeTruthy();
  });

  it('keeps what went wrong as the cause', async () => {
    const failure = new TypeError('network');
    const Screen = await lazyScreen(() => Promise.reject(failure), () => () => null)();
    const thrown = (() => {
      try {
        Screen();
      } catch (e) {
        return e;
      }
    })();
    expect(isScreenDownloadError(thrown)).toBe(true);
    expect((thrown as Error).cause).toBe(failure);
  });
});
