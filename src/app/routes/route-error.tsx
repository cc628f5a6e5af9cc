import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, Button, ButtonLink, PageHeader } from '@/components/ui';
import { isApiError } from '@/lib/api-client';
import { useDocumentTitle } from '@/lib/use-document-title';
import { NotFoundContent } from '@/components/errors/not-found-content';

function describe(error: unknown): string {
  if (isApiError(error)) return error.status === 0 ? error.message : `The server said: ${error.message}`;
  if (isRouteErrorResponse(error)) return `${error.status} ${error.statusText}`;
  return 'Something on this page broke. It is not your fault.';
}

/** errorElement of the routes: shown in place of a page whose code, loader or render failed. */
export function RouteError() {
  const error = useRouteError();
  useDocumentTitle('Something went wrong');
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundContent />;
  return (
    <>
      <PageHeader title="Something went wrong" />
      <div className="max-w-xl space-y-5">
        <Alert tone="error">{describe(error)}</Alert>
        <div className="flex flex-wrap gap-3">
          <Button onClick={() => window.location.reload()}>Try again</Button>
          <ButtonLink to={paths.home.getHref()} variant="secondary" reloadDocument>
            Back to the home page
          </ButtonLink>
        </div>
      </div>
    </>
  );
}

/** Last resort when the shell itself cannot render (e.g. /api/me unreachable at start): no header, plain page. */
export function RootError() {
  return (
    <main id="main" className="mx-auto max-w-xl px-4 py-16">
      <RouteError />
    </main>
  );
}
