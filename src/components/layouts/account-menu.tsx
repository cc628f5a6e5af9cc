import { useCallback, useEffect, useId, useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { MeUser } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { useSignOut } from '@/features/auth/api/sign-out';
import { cx } from '@/components/ui';

function initialsOf(name: string): string {
  const letters = name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((word) => word[0]!.toUpperCase());
  return letters.join('') || '?';
}

/** Closes a disclosure when focus or a click lands outside it, or on Escape (returning focus to the button). */
function useDismiss(open: boolean, close: () => void, root: React.RefObject<HTMLElement | null>, button: React.RefObject<HTMLButtonElement | null>) {
  useEffect(() => {
    if (!open) return;
    const onPointer = (event: PointerEvent) => {
      if (!root.current?.contains(event.target as Node)) close();
    };
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape') {
        close();
        button.current?.focus();
      }
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open, close, root, button]);
}

export function useSignOutAndLeave() {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return {
    signOut: () => signOut.mutate(undefined, { onSuccess: () => navigate(paths.home.getHref()) }),
    isPending: signOut.isPending,
    error: signOut.error,
  };
}

export function AccountMenu({ user }: { user: MeUser }) {
  const [open, setOpen] = useState(false);
  const menuId = useId();
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const { signOut, isPending } = useSignOutAndLeave();
  const close = useCallback(() => setOpen(false), []);
  useDismiss(open, close, root, button);

  return (
    <div ref={root} className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={menuId}
        onClick={() => setOpen((v) => !v)}
        className="flex items-center gap-2 rounded-full py-1 pr-3 pl-1 text-white hover:bg-brand-800"
      >
        <span className="flex size-8 items-center justify-center rounded-full bg-accent-300 text-sm font-bold text-ink" aria-hidden="true">
          {initialsOf(user.displayName)}
        </span>
        <span className="max-w-40 truncate font-medium">{user.displayName}</span>
        <span className="sr-only">, account menu</span>
        <svg viewBox="0 0 20 20" className={cx('size-4 transition-transform', open && 'rotate-180')} aria-hidden="true">
          <path fill="currentColor" d="M5.3 7.3a1 1 0 0 1 1.4 0L10 10.6l3.3-3.3a1 1 0 1 1 1.4 1.4l-4 4a1 1 0 0 1-1.4 0l-4-4a1 1 0 0 1 0-1.4Z" />
        </svg>
      </button>
      <div
        id={menuId}
        hidden={!open}
        className="on-light absolute right-0 z-20 mt-2 w-60 rounded-xl border border-line bg-canvas-raised p-2 text-ink shadow-lg"
      >
        <p className="truncate px-3 py-2 text-sm text-ink-muted">{user.email}</p>
        <Link to={paths.account.getHref()} onClick={close} className="block rounded-lg px-3 py-2 font-medium hover:bg-canvas-sunken">
          Account
        </Link>
        <button
          type="button"
          onClick={signOut}
          disabled={isPending}
          className="block w-full rounded-lg px-3 py-2 text-left font-medium hover:bg-canvas-sunken"
        >
          {isPending ? 'Signing out…' : 'Sign out'}
        </button>
      </div>
    </div>
  );
}
