// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, renderHook } from '@testing-library/react';
import { useAfterPaint } from './use-after-paint';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** A frame queue the test runs by hand: the browser's "paint" happens when the test says so. */
function manualFrames() {
  const frames = new Map<number, FrameRequestCallback>();
  let next = 1;
  vi.stubGlobal('requestAnimationFrame', (cb: FrameRequestCallback) => (frames.set(next, cb), next++));
  vi.stubGlobal('cancelAnimationFrame', (id: number) => frames.delete(id));
  return {
    paint() {
      const due = [...frames.values()];
      frames.clear();
      for (const cb of due) cb(performance.now());
    },
    pending: () => frames.size,
  };
}

describe('useAfterPaint', () => {
  it('is false until a frame has painted and a task has run after it', async () => {
    const frames = manualFrames();
    const { result } = renderHook(() => useAfterPaint());
    expect(result.current).toBe(false);
    // A task without a frame in between is not enough.
    await act(() => new Promise((r) => setTimeout(r, 5)));
    expect(result.current).toBe(false);
    act(() => frames.paint());
    expect(result.current).toBe(false);
    await act(() => new Promise((r) => setTimeout(r, 5)));
    expect(result.current).toBe(true);
  });

  it('cancels its frame when the component goes before the paint', () => {
    const frames = manualFrames();
    const { unmount } = renderHook(() => useAfterPaint());
    expect(frames.pending()).toBe(1);
    unmount();
    expect(frames.pending()).toBe(0);
  });
});
