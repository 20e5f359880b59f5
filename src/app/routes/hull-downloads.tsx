import { DownloadsScreen } from '../../features/exports/components/downloads-screen';
import { useHullOutlet } from './hull';

/** `/hulls/:hullId/downloads`: every export of the hull with its size and revision. */
export function HullDownloadsRoute() {
  const { hull } = useHullOutlet();
  return (
    <section aria-labelledby="downloads-heading" className="flex flex-col gap-4">
      <title>{`Downloads · ${hull.name} · Loftbench`}</title>
      <h2 id="downloads-heading" className="text-2xl font-bold">
        Downloads
      </h2>
      <DownloadsScreen hullId={hull.id} />
    </section>
  );
}
