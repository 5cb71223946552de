import { cleanup, configure } from '@testing-library/react';
import { afterEach, beforeEach, vi } from 'vitest';

// findBy… and waitFor give up after 1 s by default; on a loaded machine a screen can take longer
// to settle, so they wait up to 10 s (still bounded: a screen that never shows fails).
configure({ asyncUtilTimeout: 10_000 });

// Component tests never reach a server: any fetch a screen makes is a test mistake and fails loudly.
beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn((input: unknown) =>
      Promise.reject(new Error(`component tests make no requests (asked for ${String(input)})`)),
    ),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  window.localStorage.clear();
});
