import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { useCrew } from '../api/get-crew';
import { AddCrewForm } from './add-crew-form';
import { CrewTable } from './crew-table';
import { RoleGuide } from './role-guide';

interface CrewSectionProps {
  hullId: number;
  hullName: string;
  /** Only an owner manages the crew (DESIGN.md section 7); the server checks it again on every change. */
  canManage: boolean;
  currentUserId: number | null;
}

/** The people on a hull and their roles; an owner can add, re-role and remove them here. */
export function CrewSection({ hullId, hullName, canManage, currentUserId }: CrewSectionProps) {
  const crew = useCrew(hullId);

  return (
    <section aria-labelledby="crew-heading" className="flex flex-col gap-6">
      <div className="flex flex-col gap-1">
        <h2 id="crew-heading" className="text-2xl font-bold">
          Crew
        </h2>
        <p className="text-muted">
          {canManage ? 'The people who work on this hull. As an owner you choose who is on the crew and what each may do.' : 'The people who work on this hull. Only an owner can change the crew.'}
        </p>
      </div>

      {crew.isPending && <Loading label="Loading the crew…" />}
      {crew.isError && (
        <Alert tone="error" title="The crew could not be loaded.">
          <p>{describeError(crew.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void crew.refetch()}>
            Try again
          </Button>
        </Alert>
      )}
      {crew.isSuccess && <CrewTable hullId={hullId} hullName={hullName} crew={crew.data.crew} canManage={canManage} currentUserId={currentUserId} />}

      {canManage && (
        <Card>
          <AddCrewForm hullId={hullId} />
        </Card>
      )}

      <Card>
        <RoleGuide />
      </Card>
    </section>
  );
}
