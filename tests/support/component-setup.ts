import { cleanup } from '@testing-library/react';
import { afterEach, beforeEach, vi } from 'vitest';

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
