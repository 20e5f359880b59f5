import { useQueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import type { PinCompareResponse, PinSaveResponse } from '../../../../shared/api/library';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Loading } from '../../../components/ui/loading';
import { ApiError, describeError } from '../../../lib/api-client';
import { getHullPlanQueryOptions } from '../api/get-hull-lines';
import { usePinCompare } from '../api/get-pin-compare';
import { useMovePin } from '../api/move-pin';
import { BodyPlanDrawing } from './body-plan-drawing';
import { CamberDrawing } from './camber-drawing';
import { MovementTable } from './movement-table';

function Drawing({ data }: { data: PinCompareResponse }) {
  const from = `Revision ${data.from.number} (this hull now)`;
  const to = `Revision ${data.to.number}`;
  if (data.drawing.kind === 'camber') {
    return (
      <CamberDrawing
        halfBeamMm={data.drawing.halfBeamMm}
        title={`${data.to.name}: revision ${data.from.number} and revision ${data.to.number} drawn over each other`}
        curves={[
          { points: data.drawing.before, label: from, tone: 'before' },
          { points: data.drawing.after, label: to, tone: 'after' },
        ]}
      />
    );
  }
  return <BodyPlanDrawing drawing={data.drawing} title={`${data.to.name}: body plans of revision ${data.from.number} and revision ${data.to.number}`} beforeLabel={from} afterLabel={to} />;
}

function moveErrorText(error: unknown): string {
  if (error instanceof ApiError && error.code === 'stale_revision') return 'Someone saved the hull’s plan just now. Press the button again to move the newest revision.';
  return describeError(error);
}

export interface PinCompareProps {
  hullId: number;
  pinId: number;
  toRevisionId: number;
  /** Owner, builder and designer may move the hull (it changes the lines or camber). */
  canMove: boolean;
  /** After the move: the caller brings an open editor up to the new revision. */
  onMoved?: (saved: PinSaveResponse) => void | Promise<void>;
  /** More actions beside Move (the notice's Stay), given what is compared. */
  moreActions?: (data: PinCompareResponse) => ReactNode;
}

/** The pinned revision and another drawn over each other, how far each part would move, and the choice to move the hull or stay. */
export function PinCompare({ hullId, pinId, toRevisionId, canMove, onMoved, moreActions }: PinCompareProps) {
  const compare = usePinCompare(hullId, pinId, toRevisionId);
  const move = useMovePin(hullId, pinId);
  const queryClient = useQueryClient();

  if (compare.isPending) return <Loading label="Comparing the two revisions…" />;
  if (compare.isError) {
    return (
      <Alert tone="error" title="The two revisions could not be compared.">
        <p>{describeError(compare.error)}</p>
      </Alert>
    );
  }
  const data = compare.data;
  const moved = move.isSuccess ? move.data : null;

  const moveNow = async () => {
    try {
      const latest = await queryClient.fetchQuery({ ...getHullPlanQueryOptions(hullId), staleTime: 0 });
      const saved = await move.mutateAsync({ toRevisionId, baseRevisionId: latest.revision?.id ?? null });
      await onMoved?.(saved);
    } catch {
      // Shown from move.error below.
    }
  };

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-1">
        <h2 className="text-2xl font-bold">
          {data.to.name}: revision {data.from.number} → revision {data.to.number}
        </h2>
        <p className="text-muted">By {data.pin.authorName}. This hull follows revision {data.from.number}.</p>
      </div>
      {data.to.notes && (
        <Card>
          <h3 className="font-semibold">What the designer says of revision {data.to.number}</h3>
          <p className="max-w-prose whitespace-pre-line">{data.to.notes}</p>
          {data.to.rules && <p className="mt-2 max-w-prose whitespace-pre-line text-muted">{data.to.rules}</p>}
        </Card>
      )}
      {data.hullDiffersFromPin && (
        <Alert tone="caution" title={`This hull was changed after it took revision ${data.from.number}.`}>
          The figures below are from the hull as it is now; moving replaces that change too.
        </Alert>
      )}
      <Drawing data={data} />
      <section aria-labelledby="movement-heading" className="flex flex-col gap-2">
        <h3 id="movement-heading" className="text-xl font-bold">
          {moved ? 'How far each part moved' : 'How far each part would move'}
        </h3>
        <MovementTable movement={moved ? moved.movement : data.movement} cutPartsKnown={data.cutPartsKnown} />
      </section>
      {moved ? (
        <Alert tone="ok" title={`The hull now follows revision ${moved.pin.revisionNumber}.`}>
          Saved as plan revision {moved.revision.id}; the earlier plan revisions stay as they were.
        </Alert>
      ) : (
        <div className="flex flex-col gap-3">
          {move.isError && <Alert tone="error">{moveErrorText(move.error)}</Alert>}
          <div className="flex flex-wrap items-center gap-3">
            {canMove ? (
              <Button busy={move.isPending} onClick={() => void moveNow()}>
                Move the hull to revision {data.to.number}
              </Button>
            ) : (
              <p className="text-muted">Only the hull’s owner, builder or designer can move it to another revision.</p>
            )}
            {moreActions?.(data)}
          </div>
        </div>
      )}
    </div>
  );
}
