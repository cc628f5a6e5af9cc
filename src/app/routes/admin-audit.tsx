import { EmptyState, PageHeader } from '@/components/ui';
import { AdminNav } from '@/features/admin/components/admin-nav';
import { AuditTable } from '@/features/admin/components/audit-table';
import { AUDIT_LIST_LIMIT, useAudit } from '@/features/admin/api/get-audit';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('Audit log');
  const audit = useAudit();
  return (
    <>
      <PageHeader title="Audit log" description="Every admin action: who, what, on which target, the amounts, when." />
      <AdminNav />
      <QueryState isPending={audit.isPending} error={audit.error} retry={() => void audit.refetch()} loadingLabel="Loading the audit log">
        {() =>
          audit.data!.items.length === 0 ? (
            <EmptyState title="No admin actions yet" />
          ) : (
            <>
              <AuditTable entries={audit.data!.items} />
              {audit.data!.total > AUDIT_LIST_LIMIT ? <p className="mt-2 text-sm text-ink-muted">The newest {AUDIT_LIST_LIMIT} of {audit.data!.total} actions.</p> : null}
            </>
          )
        }
      </QueryState>
    </>
  );
}
