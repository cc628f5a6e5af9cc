import { useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { ROLE_LABELS, isRole } from '@shared/permissions';
import type { AdminAccountView } from '@shared/schemas/admin';
import { Alert, Badge, Button, TextField } from '@/components/ui';
import { useAccountAction, type AccountAction } from '../api/account-actions';
import { DataTable } from './data-table';

const col = createColumnHelper<AdminAccountView>();

const ACTION_WORDS: Record<AccountAction, string> = { disable: 'Disable', enable: 'Enable', 'grant-admin': 'Make admin' };

/** One action with its reason: the audit log keeps both, so the reason is asked every time. */
function AccountActions({ account }: { account: AdminAccountView }) {
  const mutation = useAccountAction();
  const [action, setAction] = useState<AccountAction | null>(null);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const choices: AccountAction[] = account.disabledAt ? ['enable'] : ['disable', ...(account.roles.includes('admin') ? [] : (['grant-admin'] as const))];
  if (!action) {
    return (
      <div className="flex flex-wrap gap-2">
        {choices.map((a) => (
          <Button key={a} size="sm" variant={a === 'disable' ? 'danger' : 'secondary'} onClick={() => setAction(a)} aria-label={`${ACTION_WORDS[a]} ${account.displayName}`}>
            {ACTION_WORDS[a]}
          </Button>
        ))}
      </div>
    );
  }
  async function submit() {
    setError(null);
    try {
      await mutation.mutateAsync({ userId: account.id, action: action!, input: { reason } });
      setAction(null);
      setReason('');
    } catch (err) {
      setError(err instanceof Error ? err.message : 'That did not work');
    }
  }
  return (
    <form
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <TextField label={`Why ${ACTION_WORDS[action].toLowerCase()} ${account.displayName}?`} value={reason} onChange={(e) => setReason(e.target.value)} error={error ?? undefined} />
      <div className="flex gap-2">
        <Button type="submit" size="sm" variant={action === 'disable' ? 'danger' : 'primary'} busy={mutation.isPending}>
          {ACTION_WORDS[action]}
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setAction(null)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

const columns = [
  col.accessor('displayName', { header: 'Name', cell: (c) => <span className="font-medium">{c.getValue()}</span> }),
  col.accessor('email', { header: 'Email' }),
  col.accessor((a) => a.roles.map((r) => (isRole(r) ? ROLE_LABELS[r] : r)).join(', '), { id: 'roles', header: 'Roles' }),
  col.accessor('bookings', { header: 'Bookings' }),
  col.accessor((a) => (a.disabledAt ? 'Disabled' : a.emailVerified ? 'Active' : 'Unconfirmed'), {
    id: 'state',
    header: 'State',
    cell: (c) => <Badge tone={c.getValue() === 'Disabled' ? 'danger' : c.getValue() === 'Active' ? 'success' : 'accent'}>{c.getValue()}</Badge>,
  }),
  col.accessor('createdAt', { header: 'Joined', cell: (c) => new Date(c.getValue()).toLocaleDateString(undefined, { dateStyle: 'medium' }) }),
  col.display({ id: 'actions', header: 'Actions', cell: (c) => <AccountActions account={c.row.original} /> }),
];

export function AccountsTable({ accounts }: { accounts: AdminAccountView[] }) {
  if (accounts.length === 0) return <Alert tone="info">No account matches.</Alert>;
  return <DataTable data={accounts} columns={columns} caption="Accounts" initialSorting={[{ id: 'createdAt', desc: true }]} rowTestId="account-row" />;
}
