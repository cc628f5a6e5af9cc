import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { MIC_TYPE_LABELS, POLAR_PATTERN_LABELS, SOURCES } from '@shared/mic-package';
import type { MicPackageView } from '@shared/schemas/mic-packages';
import { paths } from '@/config/paths';
import { Badge, ButtonLink, Card, ScrollRegion } from '@/components/ui';
import { PackagePairs } from './package-pairs';

/** A package as songwriters and drummers see it: the input list, read-only, with its pairs. */
export function PackageSummary({ pkg, headingLevel = 3 }: { pkg: MicPackageView; headingLevel?: 2 | 3 }) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <Card className="space-y-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <Heading className="text-lg font-bold">
          {pkg.name} {pkg.archived ? <Badge tone="neutral">removed</Badge> : null}
        </Heading>
        <span className="font-medium">{formatMoney(pkg.priceMinor, pkg.currency)}</span>
      </div>
      <p className="text-sm text-ink-muted">
        {pkg.channels.length} channels · by {pkg.engineerName} at{' '}
        <Link className="underline" to={paths.room.getHref(pkg.roomId)}>
          {pkg.roomName}
        </Link>
      </p>
      <ScrollRegion label={`Input list of ${pkg.name}`}>
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Input list of {pkg.name}</caption>
          <thead>
            <tr>
              <th scope="col" className="py-1 pr-2">Ch</th>
              <th scope="col" className="py-1 pr-2">Source</th>
              <th scope="col" className="py-1 pr-2">Mic</th>
              <th scope="col" className="py-1 pr-2">Distance</th>
              <th scope="col" className="py-1">Switches</th>
            </tr>
          </thead>
          <tbody>
            {pkg.channels.map((c) => (
              <tr key={c.number} className="border-t border-line">
                <td className="py-1 pr-2">{c.number}</td>
                <td className="py-1 pr-2">{SOURCES[c.source].label}</td>
                <td className="py-1 pr-2">
                  {MIC_TYPE_LABELS[c.micType]}, {POLAR_PATTERN_LABELS[c.pattern].toLowerCase()}
                  {c.model ? ` (${c.model})` : ''}
                </td>
                <td className="py-1 pr-2">{c.distanceCm === null ? '—' : `${c.distanceCm} cm`}</td>
                <td className="py-1">{[c.lowCut ? 'low-cut' : null, c.polarityInvert ? 'polarity inverted' : null].filter(Boolean).join(', ') || '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
      <details>
        <summary className="cursor-pointer text-sm font-medium text-brand-800">Pairs and expected polarity</summary>
        <div className="mt-2">
          <PackagePairs pairs={pkg.pairs} />
        </div>
      </details>
      {pkg.mine && !pkg.archived ? (
        <ButtonLink to={paths.editMicPackage.getHref(pkg.id)} variant="secondary" size="sm">
          Edit {pkg.name}
        </ButtonLink>
      ) : null}
    </Card>
  );
}
