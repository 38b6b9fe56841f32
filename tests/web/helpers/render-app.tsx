import { QueryClientProvider } from '@tanstack/react-query';
import { configure, render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactNode } from 'react';
import { vi } from 'vitest';
import { createMemoryRouter, MemoryRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from '../../../web/app/provider';
import { createAppRoutes } from '../../../web/app/router';
import { createQueryClient } from '../../../web/lib/query-client';

// Lazy route modules are transformed on first use; under parallel test files that can take seconds.
configure({ asyncUtilTimeout: 5000 });
vi.setConfig({ testTimeout: 20_000 });

/** The whole app (real routes, loaders and cache) in memory, starting at `path`. */
export function renderApp(path: string) {
  const queryClient = createQueryClient();
  const router = createMemoryRouter(createAppRoutes(queryClient), { initialEntries: [path] });
  const user = userEvent.setup();
  const view = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { ...view, router, queryClient, user };
}

/** One component with a fresh query cache and a memory router around it. */
export function renderWithClient(ui: ReactNode) {
  const queryClient = createQueryClient();
  const user = userEvent.setup();
  const view = render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
  return { ...view, queryClient, user };
}
