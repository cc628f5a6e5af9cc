// Test helpers for components that need the query client and a router. Only imported by *.test.tsx.
import type { ReactElement } from 'react';
import { render } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { vi } from 'vitest';

export function testQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
}

/** Renders `element` at `path` with stand-in pages for the other paths, so navigations can be asserted. */
export function renderAt(element: ReactElement, opts: { path?: string; otherRoutes?: RouteObject[]; queryClient?: QueryClient } = {}) {
  const queryClient = opts.queryClient ?? testQueryClient();
  const path = opts.path ?? '/';
  const router = createMemoryRouter([{ path, element }, ...(opts.otherRoutes ?? [])], { initialEntries: [path] });
  const utils = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...utils, router, queryClient };
}

export type FakeRoute = { method: string; path: string; status: number; body?: unknown; headers?: Record<string, string> };

/** Answers fetch from a fixed table and records the requests; an unlisted request fails the test loudly. */
export function fakeServer(routes: FakeRoute[]) {
  const calls: Array<{ method: string; path: string; body: unknown }> = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const path = String(input);
    const method = init?.method ?? 'GET';
    calls.push({ method, path, body: init?.body ? JSON.parse(String(init.body)) : undefined });
    const route = routes.find((r) => r.method === method && r.path === path);
    if (!route) throw new Error(`No fake answer for ${method} ${path}`);
    return new Response(route.body === undefined ? null : JSON.stringify(route.body), {
      status: route.status,
      headers: { 'Content-Type': 'application/json', ...route.headers },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls };
}
