import { NotFoundContent } from '@/components/errors/not-found-content';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('Page not found');
  return <NotFoundContent />;
}
