import type { ReactNode } from 'react';
import { useNavigation } from 'react-router-dom';
import { useMe } from '@/features/auth/hooks/use-me';
import { AppHeader } from './app-header';
import { AppFooter } from './app-footer';

/** A thin bar while the next page's code or data loads, so a slow click still shows it was heard. */
function NavigationProgress() {
  const navigation = useNavigation();
  if (navigation.state === 'idle') return null;
  return (
    <div className="fixed inset-x-0 top-0 z-50 h-1 overflow-hidden bg-brand-100" role="progressbar" aria-label="Loading the page">
      <div className="h-full w-1/3 animate-pulse bg-accent-400" />
    </div>
  );
}

export function AppShell({ children }: { children: ReactNode }) {
  const { user } = useMe();
  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded-lg focus:bg-canvas-raised focus:px-4 focus:py-2 focus:font-medium focus:text-ink"
      >
        Skip to content
      </a>
      <NavigationProgress />
      <AppHeader user={user} />
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-8 sm:px-6 sm:py-10">
        {children}
      </main>
      <AppFooter />
    </div>
  );
}
