import { useEffect, useState } from 'react';

/**
 * Seconds left until `until` (ms since epoch), ticking once a second; 0 when there is nothing to wait for.
 * The clock is read at render: a tick stored at mount would be stale on the render that brings a new `until`,
 * and the first figure shown would be a second or more too high.
 */
export function useCountdown(until: number | null): number {
  const [, setTick] = useState(0);
  useEffect(() => {
    if (until === null) return;
    const timer = setInterval(() => setTick((t) => t + 1), 1000);
    return () => clearInterval(timer);
  }, [until]);
  if (until === null) return 0;
  return Math.max(0, Math.ceil((until - Date.now()) / 1000));
}
