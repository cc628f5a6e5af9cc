import { PageHeader, EmptyState } from '@/components/ui';
import { AdminNav } from '@/features/admin/components/admin-nav';
import { DisputeQueueTable } from '@/features/admin/components/dispute-queue-table';
import { useDisputes } from '@/features/admin/api/get-disputes';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('Admin desk');
  const open = useDisputes('open');
  const settled = useDisputes('settled');
  return (
    <>
      <PageHeader title="Admin desk" description="Open disputes, oldest first. Each page has the terms, the thread, the deliveries and the ledger." />
      <AdminNav />
      <section aria-labelledby="open-disputes" className="space-y-3">
        <h2 id="open-disputes" className="text-xl font-bold">
          Open disputes
        </h2>
        <QueryState isPending={open.isPending} error={open.error} retry={() => void open.refetch()} loadingLabel="Loading open disputes">
          {() => (open.data!.items.length === 0 ? <EmptyState title="No open disputes">Nothing is waiting for a decision.</EmptyState> : <DisputeQueueTable disputes={open.data!.items} caption="Open disputes" />)}
        </QueryState>
      </section>
      <section aria-labelledby="settled-disputes" className="mt-8 space-y-3">
        <h2 id="settled-disputes" className="text-xl font-bold">
          Settled disputes
        </h2>
        <QueryState isPending={settled.isPending} error={settled.error} retry={() => void settled.refetch()} loadingLabel="Loading settled disputes">
          {() => (settled.data!.items.length === 0 ? <EmptyState title="None settled yet" /> : <DisputeQueueTable disputes={settled.data!.items} caption="Settled disputes" />)}
        </QueryState>
      </section>
    </>
  );
}
