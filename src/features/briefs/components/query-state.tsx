import type { ReactNode } from 'react';
import { Alert, Button, PageSpinner } from '@/components/ui';
import { isApiError } from '@/lib/api-client';

/** Loading and error states of one query, the same on every page of briefs, quotes and bookings. */
export function QueryState({
  isPending,
  error,
  retry,
  loadingLabel,
  notFoundText,
  children,
}: {
  isPending: boolean;
  error: unknown;
  retry: () => void;
  loadingLabel: string;
  notFoundText?: string;
  children: () => ReactNode;
}) {
  if (isPending) return <PageSpinner label={loadingLabel} />;
  if (error) {
    const missing = isApiError(error) && (error.status === 404 || error.status === 403);
    return (
      <Alert tone="error" title={missing ? 'Not available' : 'This could not be loaded'}>
        <p>{missing ? (notFoundText ?? 'It does not exist, or it is not shared with you.') : error instanceof Error ? error.message : 'Please try again.'}</p>
        {missing ? null : (
          <Button variant="secondary" size="sm" className="mt-3" onClick={retry}>
            Try again
          </Button>
        )}
      </Alert>
    );
  }
  return <>{children()}</>;
}
