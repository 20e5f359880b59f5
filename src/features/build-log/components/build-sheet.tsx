import { Link } from 'react-router-dom';
import { buildStages, layerStages } from '../../../../shared/api/build-log';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useBuildPart } from '../api/get-build-part';
import { photoUrl } from '../api/upload-build-photos';
import { epoxyCaution, flagWhere, layerLabel, sawCaution, stageLabels } from './build-words';

/** A part's build sheet for the bench wall: bevel table, stages, notes and photo thumbnails. Prints on plain paper. */
export function BuildSheet({ hullId, partId }: { hullId: number; partId: string }) {
  const part = useBuildPart(hullId, partId);
  if (part.isPending) return <Loading label="Loading the build sheet…" />;
  if (part.isError) return <Alert tone="error">{describeError(part.error)}</Alert>;
  const { state, events, photos, bevels } = part.data;
  const notes = events.filter((e) => e.note);
  return (
    <article className="build-sheet flex flex-col gap-4">
      {/* While the sheet is open, printing leaves out the app's header, tabs and footer: only the sheet goes on paper. */}
      <style>{'@media print { header, nav, footer, [aria-label="Parts of this hull"] { display: none !important; } .build-sheet { font-size: 11pt; } }'}</style>
      <div className="flex items-baseline justify-between gap-2">
        <h2 className="text-2xl font-bold">Build sheet: {state.name}</h2>
        <span className="flex flex-wrap gap-3 print:hidden">
          <Link to={`/hulls/${hullId}/build-log?part=${encodeURIComponent(partId)}`} className={buttonClasses('quiet')}>
            Back to the build log
          </Link>
          <Button variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
        </span>
      </div>
      <p>{buildStages.map((s) => `${state.done.includes(s) ? '☑' : '☐'} ${stageLabels[s]}`).join('   ')}</p>
      {state.layers.length > 0 && (
        <ul aria-label="Layers">
          {state.layers.map((l) => (
            <li key={l.index}>
              {layerLabel(l)}: {layerStages.map((s) => `${l.done.includes(s) ? '☑' : '☐'} ${stageLabels[s]}`).join('   ')}
            </li>
          ))}
        </ul>
      )}
      {state.flag && (
        <p className="font-semibold">
          Moved {state.flag.movedMm} mm since it was cut{flagWhere(state.flag)} (revision {state.flag.cutRevisionId}); check against the latest pattern.
        </p>
      )}
      <table className="w-full border-collapse text-left">
        <caption className="text-left font-semibold">Bevels along the edges</caption>
        <thead>
          <tr>
            {['Side', 'Edge', 'Girth (mm)', 'Saw tilt (°)', 'Sliding bevel (°)', 'Under / standing', 'Face down'].map((h) => (
              <th key={h} className="border border-rule px-2 py-1">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {bevels.map((b, i) => (
            <tr key={i}>
              <td className="border border-rule px-2 py-1">{b.side}</td>
              <td className="border border-rule px-2 py-1">{b.edge}</td>
              <td className="border border-rule px-2 py-1 tabular-nums">{b.girthMm}</td>
              <td className="border border-rule px-2 py-1 tabular-nums">{b.tiltDeg}</td>
              <td className="border border-rule px-2 py-1 tabular-nums">{b.slidingBevelDeg}</td>
              <td className="border border-rule px-2 py-1">{b.kind}</td>
              <td className="border border-rule px-2 py-1">{b.faceDown ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div>
        <h3 className="font-semibold">Notes</h3>
        {notes.length === 0 ? (
          <p>None.</p>
        ) : (
          <ul>
            {notes.map((e) => (
              <li key={e.id}>
                {stageLabels[e.stage]}
                {e.layerIndex !== null ? `, layer ${e.layerIndex + 1}` : ''} ({e.author.displayName}, {formatWhen(e.createdAt)}): {e.note}
              </li>
            ))}
          </ul>
        )}
      </div>
      {photos.length > 0 && (
        <ul className="flex flex-wrap gap-2">
          {photos.map((p) => (
            <li key={p.id}>
              <img src={photoUrl(hullId, p.id, 'thumb')} width={p.thumbWidth} height={p.thumbHeight} alt={`${state.name}, photo ${p.id}`} className="h-28 w-auto" />
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm">
        {sawCaution} {epoxyCaution}
      </p>
    </article>
  );
}
