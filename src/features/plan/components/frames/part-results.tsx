import { CircleAlert, CircleCheck, Clock, TriangleAlert } from 'lucide-react';
import type { PartResultSummary, PartsResponse } from '../../../../../shared/api/parts';
import { Alert } from '../../../../components/ui/alert';
import { Loading } from '../../../../components/ui/loading';
import { describeError } from '../../../../lib/api-client';
import { resultsNotAvailable, usePartsResults } from '../../api/get-parts-results';

const fixed = (n: number, digits: number) => n.toFixed(digits).replace(/\.?0+$/, (m) => (m.startsWith('.') ? '' : m));

function ResultCard({ result }: { result: PartResultSummary }) {
  const area = result.layers.reduce((sum, l) => sum + l.areaMm2, 0);
  return (
    <div className="flex flex-col gap-3">
      <p className={`flex items-center gap-2 font-semibold ${result.ok ? 'text-ok' : 'text-danger-strong'}`}>
        {result.ok ? <CircleCheck aria-hidden="true" className="size-5" /> : <CircleAlert aria-hidden="true" className="size-5" />}
        {result.ok ? 'Computed' : 'Could not be computed'}
      </p>
      {result.issues.length > 0 && (
        <ul className="flex flex-col gap-1">
          {result.issues.map((issue, i) => (
            <li key={`${issue.code}-${i}`} className="flex items-start gap-2">
              <CircleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-danger" />
              <span>
                {issue.message}
                {issue.field && <span className="text-muted"> ({issue.field})</span>}
              </span>
            </li>
          ))}
        </ul>
      )}
      {result.ok && (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
          <dt className="text-muted">Area, all layers</dt>
          <dd className="font-mono">{fixed(area / 1e6, 3)} m²</dd>
          <dt className="text-muted">Mass</dt>
          <dd className="font-mono">{result.massKg === null ? 'not estimated' : `${fixed(result.massKg, 2)} kg`}</dd>
          <dt className="text-muted">Saw tilt along the edge</dt>
          <dd className="font-mono">{result.bevelRangeDeg ? `${fixed(result.bevelRangeDeg[0], 1)}° to ${fixed(result.bevelRangeDeg[1], 1)}°` : 'no bevel marks'}</dd>
        </dl>
      )}
      {result.layers.length > 0 && (
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Layers of {result.name}</caption>
          <thead>
            <tr className="text-muted">
              <th scope="col" className="py-1 pr-3 font-normal">Layer</th>
              <th scope="col" className="py-1 pr-3 font-normal">Thickness</th>
              <th scope="col" className="py-1 pr-3 font-normal">Area</th>
              <th scope="col" className="py-1 pr-3 font-normal">Edge</th>
              <th scope="col" className="py-1 font-normal">Pieces</th>
            </tr>
          </thead>
          <tbody className="font-mono">
            {result.layers.map((l) => (
              <tr key={l.index} className="border-t border-rule">
                <td className="py-1 pr-3">{l.index + 1}</td>
                <td className="py-1 pr-3">{fixed(l.thicknessMm, 1)} mm</td>
                <td className="py-1 pr-3">{fixed(l.areaMm2 / 1e6, 3)} m²</td>
                <td className="py-1 pr-3">{fixed(l.perimeterMm / 1000, 2)} m</td>
                <td className="py-1">{l.pieces}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {result.warnings.length > 0 && (
        <ul className="flex flex-col gap-1">
          {result.warnings.map((w, i) => (
            <li key={`${w.code}-${i}`} className="flex items-start gap-2">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-caution" />
              <span>{w.message}</span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** The results the server computed for one part of the saved revision, or plainly why there are none. */
export function PartResults({ hullId, partId, changedSinceRevision }: { hullId: number; partId: string; changedSinceRevision: boolean }) {
  const results = usePartsResults(hullId);
  return (
    <section aria-labelledby="part-results-heading" className="flex flex-col gap-3 rounded-xl border border-rule bg-surface p-4">
      <h3 id="part-results-heading" className="text-lg font-bold">
        Results
      </h3>
      {results.isPending && <Loading label="Loading the results…" />}
      {results.isError &&
        (resultsNotAvailable(results.error) ? (
          <p className="flex items-start gap-2 text-muted">
            <Clock aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
            Results not available yet: areas, mass and bevels are worked out on the server, and this server does not do it yet.
          </p>
        ) : (
          <Alert tone="error" title="The results could not be loaded.">
            {describeError(results.error)}
          </Alert>
        ))}
      {results.isSuccess && <ResultsFor data={results.data} partId={partId} changedSinceRevision={changedSinceRevision} />}
    </section>
  );
}

function ResultsFor({ data, partId, changedSinceRevision }: { data: PartsResponse; partId: string; changedSinceRevision: boolean }) {
  const result = data.results.find((r) => r.partId === partId);
  return (
    <>
      <p className="text-sm text-muted">
        For {data.revisionId === null ? 'the plan as saved' : `revision ${data.revisionId}`}.{changedSinceRevision ? ' Your changes since are worked out once you save a revision.' : ''}
      </p>
      {result ? <ResultCard result={result} /> : <p>This part is not in the saved revision yet; save a revision to have it worked out.</p>}
    </>
  );
}

/** A part's state in the list, from the results when there are any. */
export function partStatusWords(result: PartResultSummary | undefined, available: boolean): { text: string; tone: 'ok' | 'bad' | 'warn' | 'quiet' } {
  if (!available) return { text: '—', tone: 'quiet' };
  if (!result) return { text: 'Not saved yet', tone: 'quiet' };
  if (!result.ok) return { text: `${result.issues.length} issue${result.issues.length === 1 ? '' : 's'}`, tone: 'bad' };
  if (result.warnings.length) return { text: `${result.warnings.length} warning${result.warnings.length === 1 ? '' : 's'}`, tone: 'warn' };
  return { text: 'Computed', tone: 'ok' };
}
