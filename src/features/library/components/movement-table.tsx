import type { PartMovement } from '../../../../shared/api/library';
import { Alert } from '../../../components/ui/alert';
import { mmWords } from './library-words';

/** Parts whose outline moves less than this (mm) are shown as not moving: below what a saw can follow. */
export const NO_MOVE_MM = 0.05;

/** How far each part would move, and whether it is cut already. */
function where(m: PartMovement): string {
  if (m.moveMm === null || m.moveMm < NO_MOVE_MM || m.atY === null) return m.note ?? '';
  const across = Math.abs(m.atY) < 0.5 ? 'on the centreline' : `${Math.round(Math.abs(m.atY))} mm out from the centreline`;
  const fallback = m.note && m.note !== 'outline of the marked face' ? `; ${m.note}` : '';
  return `${across}${m.atZ !== null ? `, ${Math.round(m.atZ)} mm up` : ''}${fallback}`;
}

export function MovementTable({ movement, cutPartsKnown }: { movement: PartMovement[]; cutPartsKnown: boolean }) {
  const cutAndMoving = movement.filter((m) => m.cut && m.moveMm !== null && m.moveMm >= NO_MOVE_MM);
  return (
    <div className="flex flex-col gap-2">
      {cutAndMoving.length > 0 && (
        <Alert tone="caution" title={cutAndMoving.length === 1 ? 'A part that is cut already would move.' : `${cutAndMoving.length} parts that are cut already would move.`}>
          {cutAndMoving.map((m) => `${m.partName} by ${mmWords(m.moveMm)}`).join('; ')}. Cut again, or work out a fix with the designer, before moving the hull.
        </Alert>
      )}
      <div className="overflow-x-auto rounded-xl border border-rule bg-surface" role="region" aria-label="How far each part would move" tabIndex={0}>
        <table className="w-full min-w-[36rem] border-collapse">
          <caption className="sr-only">How far each part would move</caption>
          <thead className="bg-paper text-left">
            <tr>
              <th scope="col" className="px-4 py-3 font-semibold">Part</th>
              <th scope="col" className="px-4 py-3 font-semibold">Station</th>
              <th scope="col" className="px-4 py-3 text-right font-semibold">Moves up to</th>
              <th scope="col" className="px-4 py-3 font-semibold">Where</th>
              <th scope="col" className="px-4 py-3 font-semibold">Cut?</th>
            </tr>
          </thead>
          <tbody>
            {movement.map((m) => (
              <tr key={m.partId} className="border-t border-rule align-top">
                <th scope="row" className="px-4 py-3 text-left font-semibold">{m.partName}</th>
                <td className="px-4 py-3">{m.stationName ?? (m.x !== null ? `x = ${m.x} mm` : '—')}</td>
                <td className="px-4 py-3 text-right font-mono">{m.moveMm !== null && m.moveMm < NO_MOVE_MM ? 'does not move' : mmWords(m.moveMm)}</td>
                <td className="px-4 py-3 text-muted">{where(m)}</td>
                <td className="px-4 py-3">{m.cut ? <strong className="text-danger">Cut already</strong> : cutPartsKnown ? 'Not yet' : 'Not known'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm text-muted">
        Measured on each part’s own outline (its marked face, holes included): the largest distance between the outline as it is and as it
        would be, and where on the template that is.{' '}
        {cutPartsKnown ? 'Cut: from the build log.' : 'The build log does not tell which parts are cut.'}
      </p>
    </div>
  );
}
