import { PrintShopScreen } from '../../features/exports/components/print-shop-screen';
import { useHullOutlet } from './hull';

/** `/hulls/:hullId/print-shop`: full-size patterns to print, with the tile grid before downloading, and the cut list's sheets. */
export function HullPrintShopRoute() {
  const { hull } = useHullOutlet();
  return (
    <section aria-labelledby="print-shop-heading" className="flex flex-col gap-4">
      <title>{`Print shop · ${hull.name} · Loftbench`}</title>
      <h2 id="print-shop-heading" className="text-2xl font-bold">
        Print shop
      </h2>
      <PrintShopScreen hullId={hull.id} canArrange={hull.role === 'owner' || hull.role === 'builder'} />
    </section>
  );
}
