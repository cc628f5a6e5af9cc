import { paths } from '@/config/paths';
import { ButtonLink, EmptyState, PageHeader } from '@/components/ui';

/** Shared by the catch-all route and the error boundary (a loader that throws a 404). */
export function NotFoundContent() {
  return (
    <>
      <PageHeader title="Page not found" description="There is no page at this address. It may have moved, or the link has a typo." />
      <EmptyState title="Nothing here" action={<ButtonLink to={paths.home.getHref()}>Back to the home page</ButtonLink>}>
        Check the address, or start again from the home page.
      </EmptyState>
    </>
  );
}
