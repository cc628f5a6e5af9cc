import type { MeUser } from '@shared/schemas/auth';
import { Badge } from '@/components/ui';
import { ResendVerificationButton } from './resend-verification-button';

export function EmailStatus({ user }: { user: MeUser }) {
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-2">
        <span className="font-medium break-all">{user.email}</span>
        {user.emailVerified ? <Badge tone="success">Confirmed</Badge> : <Badge tone="accent">Not confirmed yet</Badge>}
      </p>
      {user.emailVerified ? (
        <p className="text-ink-muted">Briefs, quotes and payment notices go to this address.</p>
      ) : (
        <>
          <p className="text-ink-muted">Open the link we mailed you to confirm this address. It works for 48 hours.</p>
          <ResendVerificationButton email={user.email} />
        </>
      )}
    </div>
  );
}
