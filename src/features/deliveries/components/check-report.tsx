import type { CheckItem, DeliveryCheckReport } from '@shared/schemas/delivery-check';
import type { DeliveryCheckView } from '@shared/schemas/deliveries';
import { Alert, Badge, Card } from '@/components/ui';

const LEVEL_TONE = { pass: 'success', warn: 'accent', fail: 'danger' } as const;
const LEVEL_WORD = { pass: 'Pass', warn: 'Check', fail: 'Problem' } as const;

/** The check report: the one-line summary first, then each item, its engineer's detail one click away. */
export function CheckReport({ check }: { check: DeliveryCheckView }) {
  if (check.status !== 'done' || !check.report) return <CheckProgress check={check} />;
  const report = check.report;
  return (
    <Card aria-labelledby="check-report-title">
      <h2 id="check-report-title" className="text-lg font-bold">
        Delivery check
      </h2>
      <p className="mt-1 text-base" data-testid="check-summary">
        <Badge tone={LEVEL_TONE[report.level]} className="mr-2">
          {LEVEL_WORD[report.level]}
        </Badge>
        {report.summary}
      </p>
      <ul className="mt-4 space-y-2">
        {ordered(report).map((item) => (
          <CheckRow key={item.id} item={item} />
        ))}
      </ul>
    </Card>
  );
}

function ordered(report: DeliveryCheckReport): CheckItem[] {
  const rank = { fail: 0, warn: 1, pass: 2 } as const;
  return [...report.checks].sort((a, b) => rank[a.level] - rank[b.level]);
}

function CheckRow({ item }: { item: CheckItem }) {
  return (
    <li>
      <details className="group rounded-lg border border-line px-3 py-2">
        <summary className="flex cursor-pointer items-start gap-2">
          <Badge tone={LEVEL_TONE[item.level]} className="shrink-0">
            {LEVEL_WORD[item.level]}
          </Badge>
          <span>{item.message}</span>
        </summary>
        <div className="mt-2 space-y-1 text-sm text-ink-muted">
          {item.detail ? <p className="font-mono break-words">{item.detail}</p> : null}
          {item.files.length > 0 ? <p>Files: {item.files.join(', ')}</p> : null}
          {!item.detail && item.files.length === 0 ? <p>Nothing more to add.</p> : null}
        </div>
      </details>
    </li>
  );
}

function CheckProgress({ check }: { check: DeliveryCheckView }) {
  if (check.status === 'failed') return <Alert tone="error" title="The check could not run">{check.error}</Alert>;
  const percent = Math.round(check.progress * 100);
  return (
    <Card>
      <h2 className="text-lg font-bold">Delivery check</h2>
      {check.status === 'waiting' && check.progress === 0 && !check.label ? (
        <p className="mt-1 text-ink-muted">The check starts when every file is uploaded.</p>
      ) : (
        <>
          <p className="mt-1 text-ink-muted">{check.label || 'Waiting to start'}</p>
          <progress className="mt-2 h-2 w-full" max={100} value={percent} aria-label="Check progress">
            {percent}%
          </progress>
          {check.error ? <p className="mt-2 text-sm text-ink-muted">{check.error}</p> : null}
        </>
      )}
    </Card>
  );
}
