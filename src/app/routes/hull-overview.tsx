import { useSession } from '../../features/auth/api/get-session';
import { CrewSection } from '../../features/crew/components/crew-section';
import { HullSettings } from '../../features/hulls/components/hull-settings';
import { useHullOutlet } from './hull';

/** `/hulls/:hullId`: the hull's notes, its settings and its crew. */
export function HullOverviewRoute() {
  const { hull } = useHullOutlet();
  const session = useSession();
  return (
    <div className="flex flex-col gap-8">
      <title>{`${hull.name} · Loftbench`}</title>
      {hull.notes && <p className="max-w-prose whitespace-pre-line text-muted">{hull.notes}</p>}
      <HullSettings hull={hull} />
      <CrewSection hullId={hull.id} hullName={hull.name} canManage={hull.role === 'owner'} currentUserId={session.data?.user?.id ?? null} />
    </div>
  );
}
