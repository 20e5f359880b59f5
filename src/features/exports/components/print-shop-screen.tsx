import { useMemo, useState } from 'react';
import { Download } from 'lucide-react';
import { ROLL_WIDTHS_MM, tiledPdfQuerySchema, tilingOfQuery, type TiledPdfQuery } from '../../../../shared/api/exports';
import type { PartResultSummary } from '../../../../shared/api/parts';
import { tiledPrintPageCount, tiledPrintPlan, type TiledPrintPlan } from '../../../../shared/geometry/tiling';
import { GeometryInputError } from '../../../../shared/geometry/types';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { InputField, SelectField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { hullDxfHref, partDxfHref, rollPdfHref } from '../api/export-links';
import { useExportParts } from '../api/get-export-parts';
import { usePartDrawing } from '../api/get-part-drawing';
import { CalibrationCaution } from './calibration-caution';
import { ChoiceGroup } from './choice-group';
import { CutListSheets } from './cut-list-sheets';
import { ExportJobButton } from './export-job-button';
import { TilePreview } from './tile-preview';

const PAPERS = [
  { value: 'a4', label: 'A4 (210 x 297 mm)' },
  { value: 'letter', label: 'US Letter (8.5 x 11 in)' },
  { value: 'a3', label: 'A3 (297 x 420 mm)' },
  { value: 'tabloid', label: 'Tabloid (11 x 17 in)' },
  { value: 'custom', label: 'Custom size' },
] as const;

type Paper = (typeof PAPERS)[number]['value'];

/** The settings as typed: strings until they are read by the shared query schema, which says what is wrong and where. */
interface PaperSettings {
  paper: Paper;
  widthMm: string;
  heightMm: string;
  orientation: 'portrait' | 'landscape';
  marginMm: string;
  overlapMm: string;
}

const initialSettings: PaperSettings = { paper: 'a4', widthMm: '', heightMm: '', orientation: 'portrait', marginMm: '6.35', overlapMm: '15' };

/** The query of the tiled PDF from the settings, or the problem with each field (the same schema as the server's). */
function queryOf(s: PaperSettings, layer: number): { query: TiledPdfQuery | null; errors: Record<string, string> } {
  const num = (v: string) => (v.trim() === '' ? undefined : Number(v));
  const candidate = { paper: s.paper, orientation: s.orientation, marginMm: num(s.marginMm), overlapMm: num(s.overlapMm), layer, ...(s.paper === 'custom' ? { widthMm: num(s.widthMm), heightMm: num(s.heightMm) } : {}) };
  const parsed = tiledPdfQuerySchema.safeParse(candidate);
  if (parsed.success) return { query: parsed.data, errors: {} };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) errors[String(issue.path[0] ?? 'paper')] ??= issue.message;
  return { query: null, errors };
}

/** The plan of the print, or the geometry's own words for why it cannot be made (a paper too small for the check square). */
function planOf(drawing: Parameters<typeof tiledPrintPlan>[0] | undefined, query: TiledPdfQuery | null): { plan: TiledPrintPlan | null; problem: { field?: string; message: string } | null } {
  if (!drawing || !query) return { plan: null, problem: null };
  try {
    return { plan: tiledPrintPlan(drawing, tilingOfQuery(tiledPdfQuerySchema.parse(query))), problem: null };
  } catch (e) {
    if (e instanceof GeometryInputError) return { plan: null, problem: { field: e.issues[0]?.field, message: e.message } };
    throw e;
  }
}

/** The Print shop: choose a part and layer, the paper and how to tile it, see the grid over the part with the page count, download. */
export function PrintShopScreen({ hullId, canArrange }: { hullId: number; canArrange: boolean }) {
  const parts = useExportParts(hullId);
  const built = useMemo(() => (parts.data?.results ?? []).filter((r) => r.ok), [parts.data]);
  const [chosenPartId, setPartId] = useState<string | null>(null);
  const [layer, setLayer] = useState(1);
  const [settings, setSettings] = useState<PaperSettings>(initialSettings);
  const [rollWidthMm, setRollWidth] = useState(914);
  const [dxfUnits, setDxfUnits] = useState<'mm' | 'in'>('mm');
  const [dxfScope, setDxfScope] = useState<'layer' | 'part' | 'hull'>('layer');
  const part: PartResultSummary | undefined = built.find((p) => p.partId === chosenPartId) ?? built[0];
  const partId = part?.partId ?? null;
  const drawing = usePartDrawing(hullId, partId, layer);
  const { query, errors } = queryOf(settings, layer);
  const { plan, problem } = planOf(drawing.data?.drawing, query);
  const set = <K extends keyof PaperSettings>(key: K) => (value: PaperSettings[K]) => setSettings((s) => ({ ...s, [key]: value }));

  if (parts.isPending) return <Loading label="Loading the parts…" />;
  if (parts.isError) return <Alert tone="error" title="The parts could not be loaded">{describeError(parts.error)}</Alert>;
  if (parts.data.revisionId === null) return <Alert tone="info" title="Nothing saved yet">Save a revision of the plan first: patterns are printed from saved revisions only, so every sheet names the revision it came from.</Alert>;
  if (!part) return <Alert tone="caution" title="No part can be printed yet">None of the parts of this revision can be drawn. The Frames screen says what each one needs.</Alert>;

  const unbuilt = (parts.data.results ?? []).filter((r) => !r.ok);
  const pages = plan ? tiledPrintPageCount(plan) : null;
  const left = plan ? plan.grid.tiles.filter((t) => !plan.printed.includes(t)) : [];
  const dxfHref = dxfScope === 'hull' ? hullDxfHref(hullId, dxfUnits) : partDxfHref(hullId, part.partId, dxfUnits, dxfScope === 'layer' ? layer : null);

  return (
    <div className="flex flex-col gap-6">
      <CalibrationCaution />
      <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
        <form className="flex flex-col gap-5" onSubmit={(e) => e.preventDefault()} aria-label="What to print">
          <ChoiceGroup
            legend="Part"
            name="part"
            value={part.partId}
            onChange={(id) => {
              setPartId(id);
              setLayer(1);
            }}
            options={built.map((p) => ({ value: p.partId, label: p.stationName ? `${p.name} (${p.stationName})` : p.name }))}
          />
          {unbuilt.length > 0 && <p className="text-sm text-muted">Not printable until their problems are fixed: {unbuilt.map((p) => p.name).join(', ')}.</p>}
          <ChoiceGroup
            legend="Ply layer (one file per layer)"
            name="layer"
            value={String(layer)}
            onChange={(v) => setLayer(Number(v))}
            options={part.layers.map((l) => ({ value: String(l.index + 1), label: `Layer ${l.index + 1} of ${part.layers.length}, ${l.thicknessMm} mm ply` }))}
          />
          <SelectField label="Paper" value={settings.paper} onChange={(e) => set('paper')(e.target.value as Paper)} error={errors.paper ?? (problem?.field === 'paper' ? problem.message : undefined)}>
            {PAPERS.map((p) => (
              <option key={p.value} value={p.value}>
                {p.label}
              </option>
            ))}
          </SelectField>
          {settings.paper === 'custom' && (
            <div className="grid grid-cols-2 gap-3">
              <InputField label="Width, mm" inputMode="decimal" value={settings.widthMm} onChange={(e) => set('widthMm')(e.target.value)} error={errors.widthMm} />
              <InputField label="Height, mm" inputMode="decimal" value={settings.heightMm} onChange={(e) => set('heightMm')(e.target.value)} error={errors.heightMm} />
            </div>
          )}
          <ChoiceGroup
            legend="Orientation"
            name="orientation"
            value={settings.orientation}
            onChange={(v) => set('orientation')(v as PaperSettings['orientation'])}
            options={[
              { value: 'portrait', label: 'Portrait' },
              { value: 'landscape', label: 'Landscape' },
            ]}
            inline
          />
          <div className="grid grid-cols-2 gap-3">
            <InputField label="Margin, mm" hint="What the printer cannot print" inputMode="decimal" value={settings.marginMm} onChange={(e) => set('marginMm')(e.target.value)} error={errors.marginMm ?? (problem?.field === 'marginMm' ? problem.message : undefined)} />
            <InputField label="Overlap, mm" hint="Between sheets, for taping" inputMode="decimal" value={settings.overlapMm} onChange={(e) => set('overlapMm')(e.target.value)} error={errors.overlapMm ?? (problem?.field === 'overlapMm' ? problem.message : undefined)} />
          </div>
        </form>

        <section aria-labelledby="preview-heading" className="flex min-w-0 flex-col gap-4">
          <h3 id="preview-heading" className="text-xl font-semibold">
            {part.name}, layer {layer}: the sheets of the print
          </h3>
          {drawing.isPending && <Loading label="Drawing the part…" />}
          {drawing.isError && <Alert tone="error" title="The part could not be drawn">{describeError(drawing.error)}</Alert>}
          {problem && problem.field !== 'paper' && problem.field !== 'marginMm' && problem.field !== 'overlapMm' && <Alert tone="error" title="This print cannot be made">{problem.message}</Alert>}
          {plan && pages !== null && (
            <>
              <p className="text-lg">
                <output aria-label="Pages in the PDF" className="text-3xl font-bold">
                  {pages}
                </output>{' '}
                pages: the assembly map and {plan.printed.length} sheet{plan.printed.length === 1 ? '' : 's'}, {plan.grid.cols} across by {plan.grid.rows} down.
              </p>
              <div role="img" aria-label={`Tile grid over ${part.name}: sheets ${plan.printed.map((t) => t.name).join(', ')} printed${left.length ? `, ${left.map((t) => t.name).join(', ')} left out (nothing on them)` : ''}`} className="rounded-lg border-2 border-edge bg-surface p-2">
                <TilePreview plan={plan} />
              </div>
              <p className="text-sm text-muted">
                Blue: sheets printed, with their page. Grey: left out, nothing on them. Sheets overlap by {plan.grid.overlapMm} mm. The preview is reduced: measure only the printed check square.
              </p>
              <ExportJobButton hullId={hullId} start={{ kind: 'tiled-pdf', partId: part.partId, query: query! }}>
                Tiled PDF, {pages} pages
              </ExportJobButton>
            </>
          )}
          <div className="grid gap-4 md:grid-cols-2">
            <fieldset className="flex flex-col gap-3 rounded-lg border-2 border-edge p-4">
              <legend className="px-1 font-semibold">One sheet for a copy shop or plotter</legend>
              <SelectField label="Roll width" value={String(rollWidthMm)} onChange={(e) => setRollWidth(Number(e.target.value))}>
                {ROLL_WIDTHS_MM.map((w) => (
                  <option key={w} value={w}>
                    {w} mm ({Math.round(w / 25.4)} in)
                  </option>
                ))}
              </SelectField>
              <a className={buttonClasses('secondary')} href={rollPdfHref(hullId, part.partId, layer, rollWidthMm)} download>
                <Download aria-hidden="true" className="size-5" />
                Roll PDF, layer {layer}
              </a>
            </fieldset>
            <fieldset className="flex flex-col gap-3 rounded-lg border-2 border-edge p-4">
              <legend className="px-1 font-semibold">DXF for a router or laser</legend>
              <ChoiceGroup legend="Units" name="dxf-units" value={dxfUnits} onChange={(v) => setDxfUnits(v as 'mm' | 'in')} options={[{ value: 'mm', label: 'Millimetres' }, { value: 'in', label: 'Inches' }]} inline />
              <ChoiceGroup
                legend="What"
                name="dxf-scope"
                value={dxfScope}
                onChange={(v) => setDxfScope(v as typeof dxfScope)}
                options={[
                  { value: 'layer', label: `Layer ${layer} of ${part.name}` },
                  { value: 'part', label: `Every layer of ${part.name}` },
                  { value: 'hull', label: 'Every part of the hull' },
                ]}
              />
              <a className={buttonClasses('secondary')} href={dxfHref} download>
                <Download aria-hidden="true" className="size-5" />
                DXF, {dxfUnits === 'mm' ? 'millimetres' : 'inches'}
              </a>
            </fieldset>
          </div>
        </section>
      </div>
      <CutListSheets hullId={hullId} canArrange={canArrange} />
    </div>
  );
}
