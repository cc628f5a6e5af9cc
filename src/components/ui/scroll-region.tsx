import type { ReactNode } from 'react';
import { cx } from './cx';

/**
 * A box that scrolls sideways when its content (a wide table) does not fit, as on a phone. Keyboard users
 * must be able to reach and scroll it, so it takes focus and carries a name (axe: scrollable-region-focusable).
 */
export function ScrollRegion({ label, className, children }: { label: string; className?: string; children: ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className={cx('overflow-x-auto', className)}>
      {children}
    </div>
  );
}
