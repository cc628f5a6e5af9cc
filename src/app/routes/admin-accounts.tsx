import { useDeferredValue, useState } from 'react';
import { PageHeader, TextField } from '@/components/ui';
import { AdminNav } from '@/features/admin/components/admin-nav';
import { AccountsTable } from '@/features/admin/components/accounts-table';
import { ACCOUNT_LIST_LIMIT, useAccounts } from '@/features/admin/api/get-accounts';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('Accounts');
  const [q, setQ] = useState('');
  const query = useDeferredValue(q.trim());
  const accounts = useAccounts(query);
  return (
    <>
      <PageHeader title="Accounts" description="Disable an account to end its sessions and stop it signing in; every action is in the audit log." />
      <AdminNav />
      <TextField label="Search by name or email" type="search" value={q} onChange={(e) => setQ(e.target.value)} className="mb-4 max-w-md" />
      <QueryState isPending={accounts.isPending} error={accounts.error} retry={() => void accounts.refetch()} loadingLabel="Loading accounts">
        {() => (
          <>
            <AccountsTable accounts={accounts.data!.items} />
            {accounts.data!.total > ACCOUNT_LIST_LIMIT ? (
              <p className="mt-2 text-sm text-ink-muted">
                Showing the newest {ACCOUNT_LIST_LIMIT} of {accounts.data!.total}; search to narrow down.
              </p>
            ) : null}
          </>
        )}
      </QueryState>
    </>
  );
}
