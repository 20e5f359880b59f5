import { TriangleAlert } from 'lucide-react';
import { buildStages, type BuildBoardResponse } from '../../../../shared/api/build-log';
import { Alert } from '../../../components/ui/alert';
import { stageLabels } from './build-words';

/** The whole hull at a glance: each part's stages, what is next, what is flagged, and the material so far. */
export function BuildBoard({ board, selected, onSelect }: { board: BuildBoardResponse; selected: string | null; onSelect: (partId: string) => void }) {
  const left = board.parts.filter((p) => p.next !== null).length;
  const flagged = board.parts.filter((p) => p.flag !== null);
  const { estimate, used } = board.material;
  const rows = [
    { label: 'Ply sheets (1220 × 2440)', used: used.plySheets, estimate: estimate.plySheets },
    { label: 'Epoxy for tape and cloth (ml)', used: used.epoxyMl, estimate: estimate.epoxyMl },
    { label: 'Fillet mix (ml)', used: used.fillerMl, estimate: estimate.fillerMl },
    { label: 'Glass tape (m)', used: used.tapeM, estimate: estimate.tapeM },
  ];
  return (
    <div className="flex flex-col gap-4">
      <p className="text-lg">
        <strong>{left}</strong> of {board.parts.length} parts still have work to do.
      </p>
      {flagged.length > 0 && (
        <Alert tone="caution" title={`${flagged.length} cut part${flagged.length === 1 ? '' : 's'} moved in a later revision`}>
          {flagged.map((p) => `${p.name}: ${p.flag!.movedMm} mm`).join('; ')} (more than {board.moveToleranceMm} mm). Check them against the new patterns before going on.
        </Alert>
      )}
      <ul aria-label="Parts by stage" className="grid gap-3 sm:grid-cols-2">
        {board.parts.map((p) => (
          <li key={p.partId}>
            <button
              type="button"
              onClick={() => onSelect(p.partId)}
              aria-pressed={selected === p.partId}
              className={`flex w-full flex-col gap-2 rounded-xl border-2 p-4 text-left ${selected === p.partId ? 'border-primary bg-primary-soft' : 'border-rule bg-surface'}`}
            >
              <span className="flex items-center justify-between gap-2 text-lg font-semibold">
                {p.name}
                {p.flag && (
                  <span className="inline-flex items-center gap-1 text-sm text-danger">
                    <TriangleAlert aria-hidden="true" className="size-4" /> Moved {p.flag.movedMm} mm
                  </span>
                )}
              </span>
              <span className="flex flex-wrap gap-1" aria-label={`Stages of ${p.name}`}>
                {buildStages.map((s) => (
                  <span key={s} className={`rounded px-2 py-0.5 text-sm ${p.done.includes(s) ? 'bg-primary text-white' : 'border border-rule text-muted'}`}>
                    {p.done.includes(s) ? '✓ ' : ''}
                    {stageLabels[s]}
                  </span>
                ))}
              </span>
              <span className="text-sm text-muted">
                {p.next ? `Next: ${stageLabels[p.next]}` : 'All stages done'}
                {p.photos > 0 ? ` · ${p.photos} photo${p.photos === 1 ? '' : 's'}` : ''}
              </span>
            </button>
          </li>
        ))}
      </ul>
      <table className="w-full max-w-xl text-left">
        <caption className="text-left font-semibold">Material used so far, against the cut list's estimate</caption>
        <thead>
          <tr>
            <th className="py-1">Material</th>
            <th className="py-1 text-right">Used</th>
            <th className="py-1 text-right">Estimate</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label} className="border-t border-rule">
              <td className="py-1">{r.label}</td>
              <td className="py-1 text-right tabular-nums">{Math.round(r.used * 10) / 10}</td>
              <td className="py-1 text-right tabular-nums">{r.estimate}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
