import { lazy, Suspense, useState, type ReactNode } from 'react';
import { MantineProvider } from '@mantine/core';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { isApiError } from '../lib/api-client';
import { theme } from './theme';

/** Retries only what may succeed on a second try: not 4xx answers. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createAppQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: false },
      mutations: { retry: false },
    },
  });
}

const Notifications = lazy(() =>
  import('@mantine/notifications').then((module) => ({ default: module.Notifications })),
);

export interface AppProviderProps {
  children: ReactNode;
  queryClient?: QueryClient;
}

export function AppProvider({ children, queryClient }: AppProviderProps) {
  const [client] = useState(() => queryClient ?? createAppQueryClient());
  return (
    <MantineProvider theme={theme} defaultColorScheme="auto">
      <Suspense fallback={null}>
        <Notifications position="top-right" />
      </Suspense>
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    </MantineProvider>
  );
}
