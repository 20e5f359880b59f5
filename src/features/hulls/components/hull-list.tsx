import { Link } from 'react-router-dom';
import { ChevronRight } from 'lucide-react';
import type { HullSummary } from '../../../../shared/api/hulls';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen, roleLabels, unitsLabels } from '../../../lib/labels';
import { useHulls } from '../api/get-hulls';

function HullCard({ hull }: { hull: HullSummary }) {
  return (
    <li>
      <Link
        to={`/hulls/${hull.id}`}
        className="group flex h-full min-h-28 items-start justify-between gap-4 rounded-xl border-2 border-rule bg-surface p-5 shadow-sm hover:border-primary"
      >
        <div className="flex min-w-0 flex-col gap-2">
          <h2 className="text-xl font-semibold break-words text-ink group-hover:text-primary-strong">{hull.name}</h2>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 whitespace-nowrap text-muted">
            <dt>Units</dt>
            <dd className="text-ink">{unitsLabels[hull.units]}</dd>
            <dt>Your role</dt>
            <dd className="text-ink">{roleLabels[hull.role]}</dd>
            <dt>Last change</dt>
            <dd className="font-mono whitespace-nowrap text-ink tabular-nums">
              <time dateTime={hull.updatedAt}>{formatWhen(hull.updatedAt)}</time>
            </dd>
          </dl>
          {hull.archived && <p className="font-medium text-caution">Archived</p>}
        </div>
        <ChevronRight aria-hidden="true" className="mt-1 size-7 shrink-0 text-muted group-hover:text-primary" />
      </Link>
    </li>
  );
}

function EmptyHulls() {
  return (
    <Card className="flex flex-col items-start gap-4">
      <h2 className="text-xl font-semibold">No hull yet</h2>
      <p className="max-w-prose text-lg">
        A hull holds one boat's lines, its frames and the people who work on it. Press <strong>New hull</strong> to start one for the
        boat you are building, then enter its table of offsets and add your crew.
      </p>
      <p className="max-w-prose text-muted">
        Helping on someone else's boat? Ask its owner to add you to the crew with the e-mail you signed up with; the hull then shows
        up here.
      </p>
    </Card>
  );
}

/** The signed-in person's hulls as cards, each a link to its workspace. */
export function HullList() {
  const hulls = useHulls();

  if (hulls.isPending) return <Loading label="Loading your hulls…" />;
  if (hulls.isError) {
    return (
      <Alert tone="error" title="Your hulls could not be loaded.">
        <p>{describeError(hulls.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void hulls.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  if (hulls.data.hulls.length === 0) return <EmptyHulls />;

  // Archived hulls are kept, but out of the way of the boats being built.
  const current = hulls.data.hulls.filter((hull) => !hull.archived);
  const archived = hulls.data.hulls.filter((hull) => hull.archived);
  return (
    <div className="flex flex-col gap-8">
      {current.length > 0 ? (
        <ul className="grid grid-cols-1 gap-4 md:grid-cols-2 xl:grid-cols-3" aria-label="Your hulls">
          {current.map((hull) => (
            <HullCard key={hull.id} hull={hull} />
          ))}
        </ul>
      ) : (
        <p className="text-lg text-muted">All your hulls are archived.</p>
      )}
      {archived.length > 0 && (
        <section aria-labelledby="archived-hulls-heading" className="flex flex-col gap-3">
          <h2 id="archived-hulls-heading" className="text-2xl font-bold">
            Archived hulls
          </h2>
          <ul className="grid grid-cols-1 gap-4 md:grid-cols-2 xl:grid-cols-3" aria-label="Archived hulls">
            {archived.map((hull) => (
              <HullCard key={hull.id} hull={hull} />
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
