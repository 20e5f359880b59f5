import { TriangleAlert } from 'lucide-react';

/** The words that must not be missed before a pattern goes to the saw. */
export function CalibrationCaution() {
  return (
    <div role="note" aria-labelledby="calibration-heading" className="flex gap-3 rounded-lg border-4 border-caution bg-caution-soft px-4 py-3">
      <TriangleAlert aria-hidden="true" className="mt-1 size-8 shrink-0 text-caution" />
      <div className="flex flex-col gap-1">
        <p id="calibration-heading" className="text-xl font-bold text-caution">
          Check the calibration square before cutting
        </p>
        <p className="text-ink">
          Print at actual size (100 %), with any “fit to page” turned off. Every sheet carries a 100 mm check square: measure it on each sheet, and the check dimension across the taped-up pattern. If either is off, fix the printer settings and print again; never cut from a sheet that is off.
        </p>
        <p className="text-ink">
          Patterns are cut with saws: keep guards on and hands clear of the blade. These patterns follow the plan as saved; where they disagree with the designer’s drawings or notes, ask the designer before cutting.
        </p>
      </div>
    </div>
  );
}
