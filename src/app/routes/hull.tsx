import { Link, Outlet, useOutletContext, useParams } from 'react-router-dom';
import type { HullSummary } from '../../../shared/api/hulls';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { Card } from '../../components/ui/card';
import { Loading } from '../../components/ui/loading';
import { ApiError, describeError } from '../../lib/api-client';
import { roleLabels, unitsLabels } from '../../lib/labels';
import { useHull } from '../../features/hulls/api/get-hull';
import { HullSections } from '../../features/hulls/components/hull-sections';
import { PlanBar } from '../../features/plan/components/plan-bar';
import { PlanEditorProvider } from '../../features/plan/components/plan-editor-provider';

const backLink = 'inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4';

function HullNotFound() {
  return (
    <Card className="mx-auto flex max-w-2xl flex-col items-start gap-4">
      <title>Hull not found · Loftbench</title>
      <h1 className="text-2xl font-bold">No hull here</h1>
      <p className="text-lg">
        There is no hull at this address, or you are not on its crew. If you should be, ask the hull's owner to add you with the
        e-mail you signed in with.
      </p>
      <Link to="/hulls" className={backLink}>
        Back to the hull list
      </Link>
    </Card>
  );
}

/** What the hull's pages get from the layout around them. */
export interface HullOutletContext {
  hull: HullSummary;
}

export function useHullOutlet(): HullOutletContext {
  return useOutletContext<HullOutletContext>();
}

function HullWorkspace({ hullId }: { hullId: number }) {
  const hull = useHull(hullId);

  if (hull.isPending) return <Loading label="Loading the hull…" />;
  if (hull.isError) {
    if (hull.error instanceof ApiError && hull.error.status === 404) return <HullNotFound />;
    return (
      <Alert tone="error" title="This hull could not be loaded.">
        <p>{describeError(hull.error)}</p>
        <div className="mt-3 flex flex-wrap items-center gap-4">
          <Button variant="secondary" onClick={() => void hull.refetch()}>
            Try again
          </Button>
          <Link to="/hulls" className={backLink}>
            Back to the hull list
          </Link>
        </div>
      </Alert>
    );
  }

  const { name, units, role, archived } = hull.data.hull;
  return (
    <PlanEditorProvider hull={hull.data.hull}>
      <div className="flex flex-col gap-6">
        <div className="flex flex-col gap-3">
          <h1 className="text-3xl font-bold tracking-tight break-words">{name}</h1>
          <dl className="flex flex-wrap gap-x-8 gap-y-1 text-lg">
            <div className="flex gap-2">
              <dt className="text-muted">Units</dt>
              <dd className="font-semibold">{unitsLabels[units]}</dd>
            </div>
            <div className="flex gap-2">
              <dt className="text-muted">Your role</dt>
              <dd className="font-semibold">{roleLabels[role]}</dd>
            </div>
            {archived && (
              <div className="flex gap-2">
                <dt className="sr-only">State</dt>
                <dd className="font-semibold text-caution">Archived</dd>
              </div>
            )}
          </dl>
          <PlanBar />
        </div>
        <HullSections hullId={hullId} />
        <Outlet context={{ hull: hull.data.hull } satisfies HullOutletContext} />
      </div>
    </PlanEditorProvider>
  );
}

/** `/hulls/:hullId/*`: one hull's workspace, its header and plan bar around the page of the tab chosen. */
export function HullRoute() {
  const { hullId } = useParams();
  const id = Number(hullId);
  if (!/^\d+$/.test(hullId ?? '') || !Number.isSafeInteger(id) || id <= 0) return <HullNotFound />;
  // A fresh workspace per hull, so nothing of one hull's page state leaks into the next.
  return <HullWorkspace key={id} hullId={id} />;
}
