import { useMatches } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ButtonLink, EmptyState, PageHeader } from '@/components/ui';
import { useDocumentTitle } from '@/lib/use-document-title';

/** What a route stub says about itself (router.tsx `handle`). */
export type ComingSoonHandle = { comingSoon: { title: string; description: string } };

function isComingSoonHandle(handle: unknown): handle is ComingSoonHandle {
  return typeof handle === 'object' && handle !== null && 'comingSoon' in handle;
}

/**
 * The one page behind every route stub: a link in the navigation whose feature a later issue builds.
 * When that feature lands, its route replaces the stub in router.tsx.
 */
export function Component() {
  const handle = useMatches()
    .map((m) => m.handle)
    .find(isComingSoonHandle);
  const { title, description } = handle?.comingSoon ?? { title: 'Coming soon', description: '' };
  useDocumentTitle(title);
  return (
    <>
      <PageHeader title={title} description={description} />
      <EmptyState title="Coming soon in this build" action={<ButtonLink to={paths.home.getHref()} variant="secondary">Back to the home page</ButtonLink>}>
        This part of Kitlane is not built yet. The link is here so you can see where it will live.
      </EmptyState>
    </>
  );
}
