import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui';
import { paths } from '@/config/paths';
import { useOpenThread, type OpenThreadTarget } from '../api/open-thread';

/**
 * "Message …" on a brief, a quote or a booking page: opens (or creates) the conversation and goes there.
 * Brief and booking pages render this; they do not need to know how threads are stored.
 */
export function OpenThreadButton({ target, children = 'Send a message', variant = 'secondary' }: { target: OpenThreadTarget; children?: React.ReactNode; variant?: 'primary' | 'secondary' | 'ghost' }) {
  const open = useOpenThread();
  const navigate = useNavigate();
  return (
    <div className="inline-flex flex-col gap-1">
      <Button
        variant={variant}
        busy={open.isPending}
        busyLabel="Opening…"
        onClick={() => open.mutate(target, { onSuccess: ({ thread }) => navigate(paths.messageThread.getHref(thread.id)) })}
      >
        {children}
      </Button>
      {open.isError ? (
        <p role="alert" className="text-sm font-medium text-danger-700">
          {open.error.message}
        </p>
      ) : null}
    </div>
  );
}
