import { useId, useState } from 'react';
import { Link, NavLink, useLocation } from 'react-router-dom';
import type { MeUser } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { cx } from '@/components/ui';
import { navigationFor, type NavItem } from './navigation';
import { AccountMenu, useSignOutAndLeave } from './account-menu';
import { HeaderInbox } from '@/features/notifications/components/header-inbox';
import { Wordmark } from './wordmark';

const navLinkClass = ({ isActive }: { isActive: boolean }) =>
  cx('rounded-lg px-3 py-2 font-medium text-white hover:bg-brand-800', isActive && 'bg-brand-900 underline decoration-accent-300 decoration-2 underline-offset-4');

function DesktopNav({ items }: { items: NavItem[] }) {
  return (
    <nav aria-label="Main" className="hidden lg:block">
      <ul className="flex items-center gap-1">
        {items.map((item) => (
          <li key={item.href}>
            <NavLink to={item.href} className={navLinkClass}>
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

function GuestActions() {
  return (
    <div className="flex items-center gap-2">
      <Link to={paths.signIn.getHref()} className="rounded-lg px-3 py-2 font-medium text-white hover:bg-brand-800">
        Sign in
      </Link>
      <Link to={paths.signUp.getHref()} className="rounded-lg bg-accent-300 px-3 py-2 font-bold text-ink hover:bg-accent-400">
        Join
      </Link>
    </div>
  );
}

function MobileMenu({ id, items, user }: { id: string; items: NavItem[]; user: MeUser | null }) {
  const { signOut, isPending } = useSignOutAndLeave();
  const itemClass = ({ isActive }: { isActive: boolean }) =>
    cx('block rounded-lg px-3 py-2.5 text-lg font-medium text-white hover:bg-brand-800', isActive && 'bg-brand-900');
  return (
    <nav id={id} aria-label="Main" className="border-t border-brand-800 px-4 pt-2 pb-4 lg:hidden">
      <ul className="space-y-1">
        {items.map((item) => (
          <li key={item.href}>
            <NavLink to={item.href} className={itemClass}>
              {item.label}
            </NavLink>
          </li>
        ))}
        {user ? (
          <>
            <li>
              <NavLink to={paths.account.getHref()} className={itemClass}>
                Account
              </NavLink>
            </li>
            <li>
              <button type="button" onClick={signOut} disabled={isPending} className={itemClass({ isActive: false }) + ' w-full text-left'}>
                {isPending ? 'Signing out…' : 'Sign out'}
              </button>
            </li>
          </>
        ) : null}
      </ul>
    </nav>
  );
}

export function AppHeader({ user }: { user: MeUser | null }) {
  const items = navigationFor(user ? user.roles : null);
  const menuId = useId();
  const { pathname } = useLocation();
  // The small-screen menu belongs to the page it was opened on: following a link closes it, so the new
  // page is not hidden behind it (no effect needed, the path is part of the state).
  const [menuOpenOn, setMenuOpenOn] = useState<string | null>(null);
  const menuOpen = menuOpenOn === pathname;
  const toggleMenu = () => setMenuOpenOn(menuOpen ? null : pathname);

  return (
    <header className="on-dark bg-brand-700 text-white">
      <div className="mx-auto flex max-w-6xl items-center gap-3 px-4 py-3 sm:px-6">
        <Link to={paths.home.getHref()} className="mr-2 shrink-0 rounded-lg text-white">
          <Wordmark />
          <span className="sr-only">, home</span>
        </Link>
        <DesktopNav items={items} />
        <div className="ml-auto flex items-center gap-1">
          {user ? (
            <>
              <HeaderInbox />
              <div className="hidden lg:block">
                <AccountMenu user={user} />
              </div>
            </>
          ) : (
            <GuestActions />
          )}
          <button
            type="button"
            className="ml-1 flex size-10 items-center justify-center rounded-lg text-white hover:bg-brand-800 lg:hidden"
            aria-expanded={menuOpen}
            aria-controls={menuId}
            onClick={toggleMenu}
          >
            <svg viewBox="0 0 24 24" className="size-6" aria-hidden="true">
              {menuOpen ? (
                <path d="M6 6l12 12M18 6L6 18" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
              ) : (
                <path d="M4 7h16M4 12h16M4 17h16" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
              )}
            </svg>
            <span className="sr-only">Menu</span>
          </button>
        </div>
      </div>
      {menuOpen ? <MobileMenu id={menuId} items={items} user={user} /> : null}
    </header>
  );
}
