import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { buildStages, epoxyStages, layerStages, sawStages, type BuildPhoto, type BuildStage } from '../../../../shared/api/build-log';
import type { Role } from '../../../../shared/api/hulls';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useAddBuildEvent } from '../api/add-build-event';
import { useBuildPart } from '../api/get-build-part';
import { useUploadBuildPhotos } from '../api/upload-build-photos';
import { epoxyCaution, flagWhere, sawCaution, stageLabels } from './build-words';
import { LayerMarks } from './layer-marks';
import { PhotoStrip } from './photo-strip';

const input = 'min-h-12 rounded-lg border-2 border-edge bg-surface px-3 text-lg';

/** The material fields, empty. */
const NO_MATERIAL = { plySheets: '', epoxyMl: '', fillerMl: '', tapeM: '' };

/**
 * One part at the bench: a big button for the next stage (on a laminated part, one per layer until every
 * layer is cut), a note, material used, photos, and the history.
 */
export function PartPanel({ hullId, partId, role, userId }: { hullId: number; partId: string; role: Role; userId: number | null }) {
  const part = useBuildPart(hullId, partId);
  const addEvent = useAddBuildEvent(hullId);
  const upload = useUploadBuildPhotos(hullId);
  const [note, setNote] = useState('');
  const [used, setUsed] = useState(NO_MATERIAL);
  const [error, setError] = useState<string | null>(null);
  const panel = useRef<HTMLElement>(null);
  const loaded = part.isSuccess;
  // The panel opens below the whole board; on a tablet that is off the screen, so bring it into view once.
  useEffect(() => {
    if (loaded) panel.current?.scrollIntoView?.({ block: 'start', behavior: 'smooth' });
  }, [loaded]);

  if (part.isPending) return <Loading label="Loading the part…" />;
  if (part.isError) return <Alert tone="error">{describeError(part.error)}</Alert>;
  const { state, events, photos } = part.data;
  const canKeep = role !== 'designer';
  const laminated = state.layers.length > 0;
  // On a laminated part the layer stages are marked in the layer rows; the big buttons are the part's own.
  const ownStage = (s: BuildStage) => !laminated || !layerStages.includes(s);
  const next = state.next !== null && ownStage(state.next) ? state.next : null;
  const lastDone = [...buildStages].reverse().find((s) => state.done.includes(s) && ownStage(s)) ?? null;
  const lastAny = [...buildStages].reverse().find((s) => state.done.includes(s) || state.layers.some((l) => l.done.includes(s))) ?? null;
  const upcoming = [next, ...state.layers.map((l) => l.next)].filter((s): s is BuildStage => s !== null);
  const mayDelete = (photo: BuildPhoto) => role === 'owner' || role === 'builder' || (role === 'helper' && photo.uploader.id === userId);

  const send = async (stage: BuildStage, action: 'done' | 'reopened', layerIndex: number | null = null) => {
    setError(null);
    const sentNote = note;
    const sentUsed = used;
    const amounts = Object.fromEntries(Object.entries(used).filter(([, v]) => v.trim() !== '').map(([k, v]) => [k, Number(v)]));
    try {
      await addEvent.mutateAsync({ partId, layerIndex, stage, action, note, used: amounts });
      // Cleared only if unchanged: what was typed while this mark was saving belongs to the next mark.
      setNote((current) => (current === sentNote ? '' : current));
      setUsed((current) => (current === sentUsed ? NO_MATERIAL : current));
    } catch (err) {
      setError(describeError(err));
    }
  };

  const onFiles = async (files: FileList | null) => {
    if (!files || files.length === 0) return;
    setError(null);
    try {
      await upload.mutateAsync({ partId, stage: lastAny, files: [...files] });
    } catch (err) {
      setError(describeError(err));
    }
  };

  // Below the note and the material fields when marking, so what was typed goes with the layer's mark.
  const layerMarks = laminated ? <LayerMarks layers={state.layers} busy={addEvent.isPending} canKeep={canKeep} onMark={(layerIndex, stage, action) => void send(stage, action, layerIndex)} /> : null;

  return (
    <section ref={panel} aria-labelledby="part-panel-heading" className="flex flex-col gap-4 rounded-xl border-2 border-rule bg-surface p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id="part-panel-heading" className="text-xl font-bold">
          {state.name}
        </h3>
        <Link to={`/hulls/${hullId}/build-log/${encodeURIComponent(partId)}/sheet`} className="font-semibold text-primary underline underline-offset-4">
          Build sheet to print
        </Link>
      </div>
      {state.flag && (
        <Alert tone="caution" title={`Moved ${state.flag.movedMm} mm since it was cut${flagWhere(state.flag)}`}>
          It was cut from revision {state.flag.cutRevisionId}; the latest revision moves its outline. Check it against the new pattern.
        </Alert>
      )}
      {upcoming.some((s) => epoxyStages.includes(s)) && <Alert tone="caution">{epoxyCaution}</Alert>}
      {upcoming.some((s) => sawStages.includes(s)) && <Alert tone="caution">{sawCaution}</Alert>}
      {!canKeep && layerMarks}
      {canKeep && (
        <div className="flex flex-col gap-3">
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Note (optional)</span>
            <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={2} className={`${input} py-2`} placeholder="e.g. measured 3 mm over at the sheer; trimmed to the line" />
          </label>
          <fieldset className="grid grid-cols-2 gap-2 sm:grid-cols-4">
            <legend className="font-semibold">Material used at this stage (optional)</legend>
            {(
              [
                ['plySheets', 'Ply sheets'],
                ['epoxyMl', 'Epoxy (ml)'],
                ['fillerMl', 'Fillet mix (ml)'],
                ['tapeM', 'Glass tape (m)'],
              ] as const
            ).map(([key, label]) => (
              <label key={key} className="flex flex-col gap-1">
                <span>{label}</span>
                <input type="number" inputMode="decimal" min={0} step="any" value={used[key]} onChange={(e) => setUsed({ ...used, [key]: e.target.value })} className={input} />
              </label>
            ))}
          </fieldset>
          {layerMarks}
          <div className="flex flex-wrap gap-3">
            {next && (
              <Button className="min-h-16 px-8 text-xl" busy={addEvent.isPending} onClick={() => void send(next, 'done')}>
                Mark {stageLabels[next].toLowerCase()}
              </Button>
            )}
            {lastDone && (
              <Button variant="secondary" className="min-h-16 px-6 text-lg" disabled={addEvent.isPending} onClick={() => void send(lastDone, 'reopened')}>
                Reopen {stageLabels[lastDone].toLowerCase()}
              </Button>
            )}
            <label className="inline-flex min-h-16 cursor-pointer items-center rounded-lg border-2 border-edge bg-surface px-6 text-lg font-semibold">
              {upload.isPending ? 'Uploading…' : 'Add a photo'}
              <input type="file" accept="image/*" capture="environment" multiple className="sr-only" onChange={(e) => void onFiles(e.target.files)} />
            </label>
          </div>
          {error && <Alert tone="error">{error}</Alert>}
        </div>
      )}
      <PhotoStrip hullId={hullId} partName={state.name} photos={photos} mayDelete={canKeep ? mayDelete : () => false} />
      <div>
        <h4 className="font-semibold">History</h4>
        {events.length === 0 ? (
          <p className="text-muted">Nothing marked yet.</p>
        ) : (
          <ol className="flex flex-col gap-1">
            {[...events].reverse().map((e) => (
              <li key={e.id}>
                <strong>{e.action === 'done' ? stageLabels[e.stage] : `${stageLabels[e.stage]} reopened`}</strong>
                {e.layerIndex !== null ? ` (layer ${e.layerIndex + 1})` : ''} by {e.author.displayName}, {formatWhen(e.createdAt)}
                {e.stage === 'cut' && e.action === 'done' && e.revisionId !== null ? `, from revision ${e.revisionId}` : ''}
                {e.note && <span className="block text-muted">{e.note}</span>}
              </li>
            ))}
          </ol>
        )}
      </div>
    </section>
  );
}
