import { Outlet } from 'react-router-dom';
import { AppShell } from '@/components/layouts/app-shell';

/** Every page sits inside the shell; route errors render inside it too (see router.tsx). */
export function RootLayout() {
  return (
    <AppShell>
      <Outlet />
    </AppShell>
  );
}
