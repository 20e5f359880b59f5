import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Plus } from 'lucide-react';
import type { Part } from '../../../../../shared/geometry/part-schema';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { Card } from '../../../../components/ui/card';
import { SelectField } from '../../../../components/ui/field';
import { resultsNotAvailable, usePartsResults } from '../../api/get-parts-results';
import { addableKinds, newPart, partKindLabels, type AddableKind } from '../../editor/part-defaults';
import { partAdd } from '../../editor/part-actions';
import { edit } from '../../editor/types';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { LongitudinalsSection } from './longitudinals-section';
import { PartForm } from './part-form';
import { PartResults, partStatusWords } from './part-results';
import { EmptyNote } from '../../../../components/ui/empty-note';

const toneClass = { ok: 'text-ok', bad: 'text-danger-strong', warn: 'text-caution', quiet: 'text-muted' };

function layersWords(part: Part): string {
  const thicknesses = part.layers.map((l) => l.thicknessMm);
  if (thicknesses.length === 0) return 'no layers';
  if (thicknesses.every((t) => t === thicknesses[0])) return `${thicknesses.length} × ${thicknesses[0]} mm`;
  return `${thicknesses.join(' + ')} mm`;
}

function PartsList({ selectedId, onSelect }: { selectedId: string | null; onSelect: (id: string) => void }) {
  const { hull } = usePlanEditor();
  const parts = useEditor((s) => s.plan.parts.parts);
  const stations = useEditor((s) => s.plan.lines.stations);
  const results = usePartsResults(hull.id);
  const available = results.isSuccess;
  if (parts.length === 0) return <EmptyNote>No parts yet.</EmptyNote>;
  return (
    <div className="overflow-x-auto rounded-xl border border-rule bg-surface" role="region" aria-label="Parts" tabIndex={0}>
      <table className="min-w-full border-collapse text-left">
        <caption className="sr-only">Parts of {hull.name}</caption>
        <thead className="bg-paper">
          <tr>
            <th scope="col" className="px-3 py-2">Name</th>
            <th scope="col" className="px-3 py-2">Kind</th>
            <th scope="col" className="px-3 py-2">Station</th>
            <th scope="col" className="px-3 py-2">Layers</th>
            <th scope="col" className="px-3 py-2">Status</th>
          </tr>
        </thead>
        <tbody>
          {parts.map((part) => {
            const station = 'stationId' in part ? stations.find((s) => s.id === part.stationId) : null;
            const status = partStatusWords(results.data?.results.find((r) => r.partId === part.id), available);
            const selected = part.id === selectedId;
            return (
              <tr key={part.id} className={`border-t border-rule ${selected ? 'bg-primary-soft' : ''}`}>
                <th scope="row" className="px-3 py-1">
                  <button type="button" aria-current={selected || undefined} className="min-h-12 text-left font-semibold text-primary underline underline-offset-4" onClick={() => onSelect(part.id)}>
                    {part.name}
                  </button>
                </th>
                <td className="px-3 py-1">{partKindLabels[part.kind]}</td>
                <td className="px-3 py-1">{part.kind === 'measured-frame' ? `x ${part.x} mm` : (station?.name ?? <span className="text-danger">not a station of the hull</span>)}</td>
                <td className="px-3 py-1 font-mono">{layersWords(part)}</td>
                <td className={`px-3 py-1 ${toneClass[status.tone]}`}>{status.text}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {results.isError && resultsNotAvailable(results.error) && <p className="px-3 py-2 text-sm text-muted">Status comes from the server's results, which are not available yet.</p>}
    </div>
  );
}

function AddPart({ onAdded }: { onAdded: (id: string) => void }) {
  const { store } = usePlanEditor();
  const hasStations = useEditor((s) => s.plan.lines.stations.length > 0);
  const [kind, setKind] = useState<AddableKind>('ring-frame');
  if (!hasStations) return <p className="text-muted">Add stations on the Lines screen first: every part stands at a station.</p>;
  return (
    <div className="flex flex-wrap items-end gap-3">
      <div className="min-w-60">
        <SelectField label="Kind of part" value={kind} onChange={(e) => setKind(e.target.value as AddableKind)}>
          {addableKinds.map((k) => (
            <option key={k} value={k}>
              {partKindLabels[k]}
            </option>
          ))}
        </SelectField>
      </div>
      <Button
        onClick={() => {
          const part = newPart(store.getState().plan, kind);
          if (!part) return;
          store.getState().apply(edit(`Add ${part.name}`, partAdd, { part }));
          onAdded(part.id);
        }}
      >
        <Plus aria-hidden="true" className="size-5" />
        Add part
      </Button>
    </div>
  );
}

/** The Frames screen: the hull's parts, one part's form beside its computed results, and the longitudinals. */
export function FramesScreen() {
  const { hull, canEditParts } = usePlanEditor();
  const parts = useEditor((s) => s.plan.parts.parts);
  const stations = useEditor((s) => s.plan.lines.stations);
  const longitudinals = useEditor((s) => s.plan.parts.longitudinals);
  const changedSinceRevision = useEditor((s) => s.plan.parts !== s.basePlan?.parts);
  const [params, setParams] = useSearchParams();
  const wanted = params.get('part');
  const selected = parts.find((p) => p.id === wanted) ?? parts[0] ?? null;
  const select = (id: string | null) => setParams(id ? { part: id } : {}, { replace: true });
  const readOnly = !canEditParts;

  return (
    <div className="flex flex-col gap-6">
      <title>{`Frames · ${hull.name} · Loftbench`}</title>
      <div className="flex flex-col gap-2">
        <h2 className="text-2xl font-bold">Frames</h2>
        {hull.role === 'designer' && (
          <Alert tone="info" title="Read only">
            The parts are the builder's: as designer you can read them here but not change them. You can change the lines, offsets and camber.
          </Alert>
        )}
        {hull.role === 'helper' && (
          <Alert tone="info" title="Read only">
            As a helper on this hull you can read the parts and their results, but not change them.
          </Alert>
        )}
      </div>
      <PartsList selectedId={selected?.id ?? null} onSelect={select} />
      {!readOnly && <AddPart onAdded={select} />}
      {selected && (
        <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <Card className="flex flex-col gap-4">
            <h3 className="text-xl font-bold">{selected.name}</h3>
            <PartForm key={selected.id} part={selected} stations={stations} longitudinals={longitudinals} readOnly={readOnly} onDeleted={() => select(null)} />
          </Card>
          <div className="lg:sticky lg:top-4">
            <PartResults hullId={hull.id} partId={selected.id} changedSinceRevision={changedSinceRevision} />
          </div>
        </div>
      )}
      <Card>
        <LongitudinalsSection readOnly={readOnly} />
      </Card>
    </div>
  );
}
