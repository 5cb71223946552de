import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactElement } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { vi } from 'vitest';

/** Renders one component as a screen would hold it: its own query cache, inside a router. */
export function renderWithClient(element: ReactElement) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const result = render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>{element}</MemoryRouter>
    </QueryClientProvider>,
  );
  return { queryClient, ...result };
}

/** Answers the next fetch calls in order (a body as JSON with 200, or a Response as it is) and records what was asked. */
export function answerFetch(...bodies: unknown[]) {
  const calls: { url: string; method: string; body: unknown }[] = [];
  const queue = [...bodies];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit = {}) => {
      calls.push({ url, method: init.method ?? 'GET', body: init.body ? JSON.parse(String(init.body)) : undefined });
      const next = queue.shift();
      if (next === undefined) throw new Error(`no answer prepared for ${url}`);
      if (next instanceof Response) return next;
      return new Response(JSON.stringify(next), { status: 200, headers: { 'content-type': 'application/json' } });
    }),
  );
  return calls;
}

/** The server's error answer: `{ error: { code, message, details } }` with the status. */
export const errorAnswer = (
  status: number,
  code: string,
  message: string,
  details: { path: string; message: string }[],
) =>
  new Response(JSON.stringify({ error: { code, message, details } }), {
    status,
    headers: { 'content-type': 'application/json' },
  });
