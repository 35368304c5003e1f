import type { ReactElement, ReactNode } from 'react';
import { MantineProvider } from '@mantine/core';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, type RenderResult } from '@testing-library/react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { theme } from '../app/theme';

export interface RenderWithAppOptions {
  /** The address the memory router starts at. */
  route?: string;
  /** Where the element is mounted in the route tree; defaults to `route`'s path. */
  path?: string;
  /** Further routes, e.g. the page a successful action navigates to. */
  routes?: RouteObject[];
  queryClient?: QueryClient;
}

export interface RenderWithAppResult extends RenderResult {
  queryClient: QueryClient;
  router: ReturnType<typeof createMemoryRouter>;
}

export function createTestQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false } },
  });
}

/** Renders a route tree inside Mantine (our theme), a QueryClient and a memory router, as the app does. */
export function renderRoutes(
  routes: RouteObject[],
  options: Pick<RenderWithAppOptions, 'route' | 'queryClient'> = {},
): RenderWithAppResult {
  const { route = '/', queryClient = createTestQueryClient() } = options;
  const router = createMemoryRouter(routes, { initialEntries: [route] });
  const wrapper = ({ children }: { children: ReactNode }) => (
    <MantineProvider theme={theme}>
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    </MantineProvider>
  );
  const result = render(<RouterProvider router={router} />, { wrapper });
  return { ...result, queryClient, router };
}

/** Renders one element at `route` (plus any further `routes`), through `renderRoutes`. */
export function renderWithApp(ui: ReactElement, options: RenderWithAppOptions = {}): RenderWithAppResult {
  const { route = '/', routes = [], queryClient } = options;
  const path = options.path ?? route.split('?')[0] ?? '/';
  return renderRoutes([{ path, element: ui }, ...routes], { route, queryClient });
}

/** A `fetch` answer with a JSON body. */
export function jsonResponse(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json', ...headers },
  });
}
