import { createBrowserRouter, createMemoryRouter } from 'react-router-dom';
import { routes } from './routes';

export function createAppRouter() {
  return createBrowserRouter(routes);
}

/** The same routes in memory, for component tests. */
export function createTestRouter(initialPath: string) {
  return createMemoryRouter(routes, { initialEntries: [initialPath] });
}
