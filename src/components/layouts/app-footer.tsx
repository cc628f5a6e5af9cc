import { useConfig } from '@/features/config/api/get-config';

export function AppFooter() {
  // The footer is secondary: while the config loads or if it fails, it simply shows no inbox link.
  const { data } = useConfig();
  const inbox = data?.mailInboxUrl ?? null;
  return (
    <footer className="border-t border-line bg-canvas-sunken">
      <div className="mx-auto flex max-w-6xl flex-col gap-2 px-4 py-6 text-ink-muted sm:flex-row sm:items-center sm:justify-between sm:px-6">
        <p>Kitlane — remote drum tracks</p>
        {inbox ? (
          <p>
            <a href={inbox} className="font-medium text-brand-800 underline underline-offset-2">
              Local mail inbox
            </a>{' '}
            <span className="text-sm">(mail catcher of this local build)</span>
          </p>
        ) : null}
      </div>
    </footer>
  );
}
