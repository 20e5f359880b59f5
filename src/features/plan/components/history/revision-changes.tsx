import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { Alert } from '../../../../components/ui/alert';
import { Loading } from '../../../../components/ui/loading';
import { describeError } from '../../../../lib/api-client';
import { useCompareRevisions } from '../../api/compare-revisions';
import { changeWords } from '../../format';

/** What changed from one revision to another, one line per change: what, before → after, in the hull's notation. */
export function RevisionChanges({ hullId, from, to, notation }: { hullId: number; from: number; to: number; notation: Notation }) {
  const compare = useCompareRevisions(hullId, { from, to });
  if (compare.isPending) return <Loading label="Comparing the two revisions…" />;
  if (compare.isError) return <Alert tone="error" title="The revisions could not be compared.">{describeError(compare.error)}</Alert>;
  const changes = compare.data.changes;
  return (
    <section aria-labelledby="changes-heading" className="flex flex-col gap-3">
      <h3 id="changes-heading" className="text-xl font-bold">
        From revision {from} to revision {to}: {changes.length === 0 ? 'no changes' : `${changes.length} change${changes.length === 1 ? '' : 's'}`}
      </h3>
      {changes.length > 0 && (
        <div className="overflow-x-auto rounded-xl border border-rule bg-surface" role="region" aria-label="Changes" tabIndex={0}>
          <table className="min-w-full border-collapse text-left">
            <caption className="sr-only">
              Changes from revision {from} to revision {to}
            </caption>
            <thead className="bg-paper">
              <tr>
                <th scope="col" className="px-4 py-2">What</th>
                <th scope="col" className="px-4 py-2">Before</th>
                <th scope="col" className="px-4 py-2">
                  <span className="sr-only">becomes</span>
                </th>
                <th scope="col" className="px-4 py-2">After</th>
              </tr>
            </thead>
            <tbody>
              {changes.map((change) => {
                const words = changeWords(change, notation);
                return (
                  <tr key={change.path} className="border-t border-rule">
                    <th scope="row" className="px-4 py-2 font-semibold">
                      {words.label}
                    </th>
                    <td className="px-4 py-2 font-mono">{words.before}</td>
                    <td aria-hidden="true" className="px-1 py-2 text-muted">
                      →
                    </td>
                    <td className="px-4 py-2 font-mono">{words.after}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
