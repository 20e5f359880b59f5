import { Link } from 'react-router-dom';
import type { HullPin } from '../../../../shared/api/library';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useHullPins } from '../api/get-hull-pins';
import { kindLabels } from './library-words';

const link = 'inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4';

function PinRow({ pin }: { pin: HullPin }) {
  const newer = pin.latestRevisionNumber !== null && pin.latestRevisionId !== null && pin.latestRevisionNumber > pin.revisionNumber;
  return (
    <li className="flex flex-col gap-2 rounded-xl border border-rule bg-surface p-5">
      <p className="text-sm font-semibold tracking-wide text-muted uppercase">{kindLabels[pin.kind]}</p>
      <p className="text-lg font-semibold">
        {pin.visible ? (
          <Link to={`/library/${pin.itemId}`} className={link}>
            {pin.itemName}
          </Link>
        ) : (
          pin.itemName
        )}{' '}
        <span className="font-normal">by {pin.authorName}</span>
      </p>
      <p>
        This hull follows <strong>revision {pin.revisionNumber}</strong>, taken by {pin.pinnedByName} on {formatWhen(pin.pinnedAt)}.
      </p>
      {!pin.visible && <p className="text-muted">Its author does not share it with you, so only what this hull took is shown here, not newer revisions.</p>}
      {newer && (
        <Alert tone="caution" title={`Revision ${pin.latestRevisionNumber} is published.`}>
          <Link to={`/hulls/${pin.hullId}/library/${pin.id}/compare?to=${pin.latestRevisionId}`} className={link}>
            Compare revision {pin.revisionNumber} with revision {pin.latestRevisionNumber}
          </Link>
        </Alert>
      )}
      {pin.visible && !newer && <p className="text-muted">That is the newest revision.</p>}
    </li>
  );
}

/** What the hull took from the Library, and whether anything newer is out. */
export function HullPins({ hullId }: { hullId: number }) {
  const pins = useHullPins(hullId);
  if (pins.isPending) return <Loading label="Loading what this hull took from the Library…" />;
  if (pins.isError) {
    return (
      <Alert tone="error" title="This could not be loaded.">
        <p>{describeError(pins.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void pins.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  if (pins.data.pins.length === 0) {
    return (
      <p className="text-lg">
        This hull has taken nothing from the Library yet.{' '}
        <Link to="/library" className={link}>
          Find camber curves and lines in the Library
        </Link>
      </p>
    );
  }
  return (
    <ul className="flex flex-col gap-4">
      {pins.data.pins.map((p) => (
        <PinRow key={p.id} pin={p} />
      ))}
    </ul>
  );
}
