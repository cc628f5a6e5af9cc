import { useEffect, useState } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { isApiError, setUnauthorizedHandler } from '@/lib/api-client';
import { setMe } from '@/features/auth/api/set-me';
import { createAppRouter } from './router';

/** A 4xx will not change by asking again; network blips and 5xx get two more tries. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createAppQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000 },
      mutations: { retry: false },
    },
  });
}

export function AppProvider() {
  const [queryClient] = useState(createAppQueryClient);
  const [router] = useState(() => createAppRouter(queryClient));

  // A 401 anywhere means the session ended (expired, signed out elsewhere): show the app as signed out.
  useEffect(() => {
    setUnauthorizedHandler(() => setMe(queryClient, null));
    return () => setUnauthorizedHandler(null);
  }, [queryClient]);

  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
