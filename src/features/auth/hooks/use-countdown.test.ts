// @vitest-environment jsdom
import { act, renderHook } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useCountdown } from './use-countdown';

afterEach(() => vi.useRealTimers());

describe('useCountdown', () => {
  it('shows the right figure on the first render with a new deadline, even long after mounting', () => {
    vi.useFakeTimers({ now: 1_000_000 });
    // Every rendered figure is kept: the page shows each one, not just the last.
    const shown: number[] = [];
    const { rerender } = renderHook(({ until }) => {
      const seconds = useCountdown(until);
      shown.push(seconds);
      return seconds;
    }, { initialProps: { until: null as number | null } });
    expect(shown).toEqual([0]);
    vi.setSystemTime(1_005_000); // five seconds pass before the 429 arrives
    shown.length = 0;
    rerender({ until: 1_005_000 + 37_000 });
    expect(shown.length).toBeGreaterThan(0);
    expect(new Set(shown)).toEqual(new Set([37]));
  });

  it('ticks down once a second and stops at zero', () => {
    vi.useFakeTimers({ now: 2_000_000 });
    const { result } = renderHook(() => useCountdown(2_000_000 + 2_500));
    expect(result.current).toBe(3);
    act(() => void vi.advanceTimersByTime(1_000));
    expect(result.current).toBe(2);
    act(() => void vi.advanceTimersByTime(3_000));
    expect(result.current).toBe(0);
  });
});
