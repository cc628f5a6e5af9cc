import type { ReactNode } from 'react';
import { Card, PageHeader } from '@/components/ui';

/** The narrow one-card layout the sign-in, sign-up and password pages share. */
export function AuthPageLayout({ title, description, children }: { title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <div className="mx-auto max-w-xl">
      <PageHeader title={title} description={description} />
      <Card>{children}</Card>
    </div>
  );
}
