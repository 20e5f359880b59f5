import { useParams } from 'react-router-dom';
import { useSession } from '../../features/auth/api/get-session';
import { BuildLogScreen } from '../../features/build-log/components/build-log-screen';
import { BuildSheet } from '../../features/build-log/components/build-sheet';
import { useHullOutlet } from './hull';

/** `/hulls/:hullId/build-log`: the shop floor's record of every part. */
export function HullBuildLogRoute() {
  const { hull } = useHullOutlet();
  const session = useSession();
  return (
    <section aria-labelledby="build-log-heading" className="flex flex-col gap-4">
      <title>{`Build log · ${hull.name} · Loftbench`}</title>
      <h2 id="build-log-heading" className="text-2xl font-bold print:hidden">
        Build log
      </h2>
      <BuildLogScreen hullId={hull.id} role={hull.role} userId={session.data?.user?.id ?? null} />
    </section>
  );
}

/** `/hulls/:hullId/build-log/:partId/sheet`: one part's printable build sheet. */
export function HullBuildSheetRoute() {
  const { hull } = useHullOutlet();
  const { partId = '' } = useParams();
  return (
    <section className="flex flex-col gap-4">
      <title>{`Build sheet · ${hull.name} · Loftbench`}</title>
      <BuildSheet hullId={hull.id} partId={partId} />
    </section>
  );
}
