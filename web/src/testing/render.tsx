import type { ReactElement } from 'react';
import { render, type RenderResult } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { Providers } from '@/app/providers';
import { createTestRouter } from '@/app/router';

/** A fresh SWR cache per test, no deduping and no retries: each test starts clean. */
const testSwr = { provider: () => new Map(), dedupingInterval: 0, shouldRetryOnError: false, errorRetryCount: 0 };

export type AppRender = RenderResult & { router: ReturnType<typeof createTestRouter>; user: ReturnType<typeof userEvent.setup> };

/** The whole app (real routes, layouts, guard) at `path`, in memory. */
export function renderApp(path: string): AppRender {
  const router = createTestRouter(path);
  const result = render(
    <Providers swr={testSwr}>
      <RouterProvider router={router} />
    </Providers>,
  );
  return { ...result, router, user: userEvent.setup({ delay: null }) };
}

/** One component with the app's providers and a router around it. */
export function renderWithProviders(ui: ReactElement, { path = '/' }: { path?: string } = {}) {
  const router = createMemoryRouter([{ path: '*', element: ui }], { initialEntries: [path] });
  const result = render(
    <Providers swr={testSwr}>
      <RouterProvider router={router} />
    </Providers>,
  );
  return { ...result, router, user: userEvent.setup({ delay: null }) };
}

/** Sets the cookie the API would have set on an earlier response. */
export function setCsrfCookie(value: string) {
  document.cookie = `sagline_csrf=${value}; path=/`;
}
