import { afterEach, beforeEach, vi } from 'vitest';

// STYLE.md: a test fails on an unexpected console.error. Tests that expect one spy on it themselves.
let spy: ReturnType<typeof vi.spyOn> | undefined;
beforeEach(() => {
  spy = vi.spyOn(console, 'error');
});
afterEach(() => {
  const calls = spy?.mock.calls ?? [];
  spy?.mockRestore();
  if (calls.length > 0) {
    throw new Error(`unexpected console.error: ${calls.map((c: unknown[]) => c.map(String).join(' ')).join('\n')}`);
  }
});
