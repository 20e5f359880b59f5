import { HullPins } from '../../features/library/components/hull-pins';
import { useHullOutlet } from './hull';

/** `/hulls/:hullId/library`: what this hull took from the Library. */
export function HullLibraryRoute() {
  const { hull } = useHullOutlet();
  return (
    <section aria-labelledby="hull-library-heading" className="flex flex-col gap-4">
      <title>{`From the Library · ${hull.name} · Loftbench`}</title>
      <div className="flex flex-col gap-1">
        <h2 id="hull-library-heading" className="text-2xl font-bold">
          From the Library
        </h2>
        <p className="text-muted">The camber curve and lines this hull took from the Library, the revision it follows, and whether a newer one is out.</p>
      </div>
      <HullPins hullId={hull.id} />
    </section>
  );
}
