import { Download } from 'lucide-react';
import { buttonClasses } from '../../../../components/ui/button';
import { exportOffsetsCsvHref } from '../../api/export-offsets-csv';
import { exportPlanJsonHref } from '../../api/export-plan-json';

/** Download the last saved revision's table (CSV, in any of the three units) or the whole plan (JSON). */
export function DownloadsLinks({ hullId, hasRevision }: { hullId: number; hasRevision: boolean }) {
  return (
    <section aria-labelledby="lines-downloads-heading" className="flex flex-col gap-3">
      <h4 id="lines-downloads-heading" className="text-lg font-semibold">
        Download
      </h4>
      <p className="text-muted">{hasRevision ? 'Downloads are of the last saved revision, not of changes still in your draft.' : 'Nothing is saved yet: save a revision first to download it.'}</p>
      {hasRevision && (
        <ul className="flex flex-wrap gap-2">
          <li>
            <a className={buttonClasses('secondary')} href={exportOffsetsCsvHref(hullId, 'mm')} download>
              <Download aria-hidden="true" className="size-5" />
              Offsets, CSV in millimetres
            </a>
          </li>
          <li>
            <a className={buttonClasses('secondary')} href={exportOffsetsCsvHref(hullId, 'ftin')} download>
              <Download aria-hidden="true" className="size-5" />
              Offsets, CSV in feet-inches-eighths
            </a>
          </li>
          <li>
            <a className={buttonClasses('secondary')} href={exportOffsetsCsvHref(hullId, 'in')} download>
              <Download aria-hidden="true" className="size-5" />
              Offsets, CSV in inches
            </a>
          </li>
          <li>
            <a className={buttonClasses('secondary')} href={exportPlanJsonHref(hullId)} download>
              <Download aria-hidden="true" className="size-5" />
              Whole plan, JSON
            </a>
          </li>
        </ul>
      )}
    </section>
  );
}
