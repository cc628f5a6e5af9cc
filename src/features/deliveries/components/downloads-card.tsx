import { deliveryPaths, type DeliveryView } from '@shared/schemas/deliveries';
import { Card } from '@/components/ui';
import { formatBytes } from '../lib/format';

/** The originals, once unlocked: one by one or as one uncompressed zip with a manifest. */
export function DownloadsCard({ delivery }: { delivery: DeliveryView }) {
  if (!delivery.can.downloadOriginals) {
    return (
      <Card>
        <h2 className="text-lg font-bold">Original files</h2>
        <p className="mt-1 text-ink-muted">The full-quality WAV files unlock when you accept the delivery. Until then you listen to previews.</p>
      </Card>
    );
  }
  return (
    <Card>
      <h2 className="text-lg font-bold">Original files</h2>
      <p className="mt-2">
        <a className="font-medium text-brand-800 underline" href={deliveryPaths.zip(delivery.id)} download>
          Download all as a zip
        </a>{' '}
        <span className="text-sm text-ink-muted">(uncompressed, with a manifest of SHA-256 hashes)</span>
      </p>
      <ul className="mt-2 space-y-1 text-sm">
        {delivery.files
          .filter((f) => f.status === 'uploaded')
          .map((f) => (
            <li key={f.id}>
              <a className="underline" href={deliveryPaths.original(delivery.id, f.id)} download>
                {f.name}
              </a>{' '}
              <span className="text-ink-muted">{formatBytes(f.sizeBytes)}</span>
            </li>
          ))}
      </ul>
    </Card>
  );
}
