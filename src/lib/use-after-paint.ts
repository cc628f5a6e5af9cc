import { useEffect, useState } from 'react';

/**
 * False on mount, true in a task of its own once the browser has painted the page. Heavy downloads that are
 * not needed for the first view (a dozen audio previews, their waveforms) wait for it: started beside the
 * first paint they share its task, and on a slow link they hold the page's text back behind megabytes of audio.
 */
export function useAfterPaint(): boolean {
  const [painted, setPainted] = useState(false);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    // The frame callback runs just before the paint; the timeout after it is the first task past the paint.
    const frame = requestAnimationFrame(() => {
      timer = setTimeout(() => setPainted(true), 0);
    });
    return () => {
      cancelAnimationFrame(frame);
      if (timer !== undefined) clearTimeout(timer);
    };
  }, []);
  return painted;
}
