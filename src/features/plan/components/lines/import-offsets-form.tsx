import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { Upload } from 'lucide-react';
import type { CsvCellIssue } from '../../../../../shared/api/plan';
import { lengthUnitSchema, sixteenthMarksSchema } from '../../../../../shared/geometry/notation-schema';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { SelectField } from '../../../../components/ui/field';
import { ApiError, describeError } from '../../../../lib/api-client';
import { getPlanQueryOptions } from '../../api/get-plan';
import { badCellsOf, useImportOffsets } from '../../api/import-offsets';
import { useImportPlanJson } from '../../api/import-plan-json';
import { revisionSavedInCache, type SavedRevision } from '../../api/save-revision';
import { openSnapshot } from '../../editor/initial-snapshot';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';

const unitChoices = [
  ['mm', 'Millimetres', '1049.5'],
  ['in', 'Inches', '41 5/16 or 41.3125'],
  ['ftin', 'Feet-inches-eighths', '3-5-2+'],
] as const;

const schema = z.object({
  file: z.custom<FileList>((v) => !!v && typeof (v as FileList).length === 'number' && (v as FileList).length === 1, 'Choose the CSV file to import'),
  // A radio group with nothing chosen gives null.
  unit: lengthUnitSchema.nullish().refine((v) => v !== undefined && v !== null, 'Choose the units the file is written in: a table is never guessed'),
  decimalComma: z.boolean(),
  sixteenthMarks: sixteenthMarksSchema,
});
type Values = z.input<typeof schema>;

const marksLabels = {
  'plus-sixteenth': '+ adds 1/16 in (and +- 1/32, ++ 3/32, - takes 1/16 off)',
  'plus-only': 'Only + (1/16 in)',
  none: 'No marks after the eighths',
} as const;

function conflictWords(error: unknown): string {
  if (error instanceof ApiError && error.status === 409) return 'Someone saved a newer revision since you opened this plan, so nothing was imported. Reload the page to get their revision, then import again.';
  return describeError(error);
}

/** After an import: the new revision is the working copy (the person was warned their unsaved lines go). */
function useTakeImported() {
  const { hull, store } = usePlanEditor();
  const queryClient = useQueryClient();
  return async (saved: SavedRevision, what: string) => {
    const fresh = await queryClient.fetchQuery({ ...getPlanQueryOptions(hull.id), staleTime: 0 });
    await revisionSavedInCache(queryClient, hull.id, saved.revision, fresh.plan);
    const opened = openSnapshot(fresh, null);
    if (opened.ok) store.getState().load({ ...opened.snapshot, notice: `${what} Saved as revision ${saved.revision.id}: ${saved.revision.summary}` });
  };
}

function BadCells({ cells }: { cells: CsvCellIssue[] }) {
  return (
    <div className="overflow-x-auto" role="region" aria-label="Cells the server could not read" tabIndex={0}>
      <table className="min-w-full border-collapse text-left">
        <caption className="sr-only">Cells of the file that could not be read</caption>
        <thead className="bg-paper">
          <tr>
            <th scope="col" className="px-3 py-2">Row</th>
            <th scope="col" className="px-3 py-2">Column</th>
            <th scope="col" className="px-3 py-2">Value</th>
            <th scope="col" className="px-3 py-2">What is wrong</th>
          </tr>
        </thead>
        <tbody>
          {cells.map((cell, i) => (
            <tr key={`${cell.row}-${cell.column}-${i}`} className="border-t border-rule">
              <td className="px-3 py-2 font-mono">{cell.row}</td>
              <td className="px-3 py-2">
                {cell.columnName || `column ${cell.column}`} <span className="text-muted">({cell.column})</span>
              </td>
              <td className="px-3 py-2 font-mono">{cell.value === '' ? <span className="text-muted">empty</span> : cell.value}</td>
              <td className="px-3 py-2">{cell.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/**
 * Import a table of offsets from a CSV file (as a spreadsheet saves it). The units are a required choice;
 * the server reads the file, lists every cell it cannot read (row, column, value, why) and otherwise
 * saves it as a new revision.
 */
export function ImportOffsetsForm() {
  const { hull } = usePlanEditor();
  const baseRevisionId = useEditor((s) => s.baseRevisionId);
  const changed = useEditor((s) => s.plan !== s.basePlan);
  const hullUnit = useEditor((s) => s.plan.lines.notation.unit);
  const importCsv = useImportOffsets(hull.id);
  const take = useTakeImported();
  const {
    register,
    handleSubmit,
    watch,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { unit: undefined, decimalComma: false, sixteenthMarks: 'plus-sixteenth' } });
  const unit = watch('unit');
  const [failure, setFailure] = useState<{ message: string; cells: CsvCellIssue[] } | null>(null);

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const file = values.file[0]!;
    try {
      const saved = await importCsv.mutateAsync({ file, baseRevisionId, unit: values.unit!, decimalComma: values.decimalComma, sixteenthMarks: values.sixteenthMarks });
      await take(saved, `Imported ${file.name}.`);
      reset();
    } catch (error) {
      setFailure({ message: conflictWords(error), cells: badCellsOf(error) });
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-labelledby="import-csv-heading">
      <h4 id="import-csv-heading" className="text-lg font-semibold">
        Import offsets from a CSV file
      </h4>
      <p className="text-muted">
        One row per line and one column per station, headed <span className="font-mono">line, kind, fixed, angle, knuckle</span> then the station names, with a row of kind{' '}
        <span className="font-mono">x</span> for the stations’ positions — the layout the CSV download has. Importing saves a new revision.
      </p>
      {changed && <Alert tone="caution">You have changes not saved as a revision. Importing replaces the stations and lines with the file’s, on top of the last saved revision.</Alert>}
      <div className="flex flex-col gap-1.5">
        <label htmlFor="import-file" className="font-semibold">
          CSV file
        </label>
        <input
          id="import-file"
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/plain"
          aria-invalid={errors.file ? true : undefined}
          aria-describedby={errors.file ? 'import-file-error' : undefined}
          className="min-h-12 rounded-lg border-2 border-edge bg-surface p-2"
          {...register('file')}
        />
        {errors.file && (
          <p id="import-file-error" className="font-medium text-danger">
            {String(errors.file.message)}
          </p>
        )}
      </div>
      <fieldset className="flex flex-col gap-2" aria-describedby={errors.unit ? 'import-unit-error' : undefined}>
        <legend className="font-semibold">Units the file is written in</legend>
        <div className="flex flex-wrap gap-2">
          {unitChoices.map(([value, label, example]) => (
            <label key={value} className="flex min-h-12 items-center gap-2 rounded-lg border-2 border-edge bg-surface px-3 has-checked:border-primary has-checked:bg-primary-soft">
              <input type="radio" value={value} className="size-5" {...register('unit')} />
              <span>
                {label} <span className="font-mono text-sm text-muted">{example}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.unit && (
          <p id="import-unit-error" className="font-medium text-danger">
            {errors.unit.message}
          </p>
        )}
        {!unit && <p className="text-sm text-muted">This hull is written in {hullUnit === 'mm' ? 'millimetres' : hullUnit === 'in' ? 'inches' : 'feet-inches-eighths'}; the file may differ.</p>}
      </fieldset>
      <label className="flex min-h-12 items-center gap-3">
        <input type="checkbox" className="size-6" {...register('decimalComma')} />
        <span>Decimals are written with a comma (1049,5)</span>
      </label>
      {unit === 'ftin' && (
        <SelectField label="Marks after the eighths" {...register('sixteenthMarks')}>
          {sixteenthMarksSchema.options.map((marks) => (
            <option key={marks} value={marks}>
              {marksLabels[marks]}
            </option>
          ))}
        </SelectField>
      )}
      {failure && (
        <Alert tone="error" title="Nothing was imported">
          <p>{failure.cells.length ? `${failure.cells.length} cell${failure.cells.length === 1 ? '' : 's'} could not be read. Put them right in the file and import it again.` : failure.message}</p>
          {failure.cells.length > 0 && <BadCells cells={failure.cells} />}
        </Alert>
      )}
      <div>
        <Button type="submit" busy={isSubmitting}>
          <Upload aria-hidden="true" className="size-5" />
          Import offsets
        </Button>
      </div>
    </form>
  );
}

/** Import a whole plan as a Loftbench plan document (JSON), e.g. one downloaded from another hull. */
export function ImportPlanJsonForm() {
  const { hull } = usePlanEditor();
  const baseRevisionId = useEditor((s) => s.baseRevisionId);
  const importJson = useImportPlanJson(hull.id);
  const take = useTakeImported();
  const [file, setFile] = useState<File | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    setError(null);
    if (!file) {
      setError('Choose the plan file (JSON) to import.');
      return;
    }
    let document: unknown;
    try {
      document = JSON.parse(await file.text());
    } catch {
      setError(`${file.name} is not a JSON file; choose a plan downloaded from Loftbench.`);
      return;
    }
    setBusy(true);
    try {
      const saved = await importJson.mutateAsync({ baseRevisionId, document });
      await take(saved, `Imported the plan from ${file.name}.`);
      setFile(null);
    } catch (e) {
      setError(conflictWords(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="flex flex-col gap-3">
      <h4 className="text-lg font-semibold">Import a whole plan (JSON)</h4>
      <p className="text-muted">A plan downloaded from Loftbench: lines, settings and parts. It replaces the whole plan with a new revision.</p>
      <label htmlFor="import-json" className="font-semibold">
        Plan file
      </label>
      <input id="import-json" type="file" accept=".json,application/json" className="min-h-12 rounded-lg border-2 border-edge bg-surface p-2" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
      {error && <Alert tone="error">{error}</Alert>}
      <div>
        <Button variant="secondary" busy={busy} onClick={() => void submit()}>
          <Upload aria-hidden="true" className="size-5" />
          Import plan
        </Button>
      </div>
    </div>
  );
}
