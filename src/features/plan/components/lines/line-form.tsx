import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Plus } from 'lucide-react';
import type { Line } from '../../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat, lengthParse } from '../../../../../shared/geometry/notation';
import { degToRad, radToDeg } from '../../../../../shared/geometry/types';
import { Button } from '../../../../components/ui/button';
import { InputField, SelectField } from '../../../../components/ui/field';
import type { LineSpec } from '../../editor/line-actions';
import { lengthInputMode } from '../../length-field';

export const lineKindChoices = [
  ['waterline', 'Waterline (half-breadths at a height)'],
  ['buttock', 'Buttock (heights at a half-breadth)'],
  ['diagonal', 'Diagonal (distances along a line in the section)'],
  ['sheer', 'Sheer (height and half-breadth)'],
  ['chine', 'Chine (height and half-breadth)'],
  ['keel', 'Keel or rabbet (height and half-breadth)'],
  ['other', 'Other point line (height and half-breadth)'],
] as const;
export type LineKindChoice = (typeof lineKindChoices)[number][0];

export interface LineFormValues {
  kind: LineKindChoice;
  name: string;
  fixed: string;
  angle: string;
  knuckle: boolean;
}

export interface LineFormResult {
  name: string;
  spec: LineSpec;
  knuckle: boolean;
}

const roleNames = { sheer: 'Sheer', chine: 'Chine', keel: 'Keel', other: 'Point line' } as const;

function lineFormSchema(notation: Notation) {
  return z
    .object({ kind: z.enum(lineKindChoices.map(([k]) => k) as [LineKindChoice, ...LineKindChoice[]]), name: z.string().max(40, 'A line name is at most 40 characters'), fixed: z.string(), angle: z.string(), knuckle: z.boolean() })
    .transform((v, ctx): LineFormResult => {
      const length = (what: string) => {
        const read = lengthParse(v.fixed, notation);
        if (read === null || !read.ok) {
          ctx.addIssue({ code: 'custom', path: ['fixed'], message: read === null ? `Enter ${what}` : read.message });
          return 0;
        }
        return read.mm;
      };
      let spec: LineSpec;
      let autoName: string;
      if (v.kind === 'waterline') {
        spec = { kind: 'waterline', z: length('the waterline’s height') };
        autoName = `WL ${v.fixed.trim()}`;
      } else if (v.kind === 'buttock') {
        spec = { kind: 'buttock', y: length('the buttock’s half-breadth') };
        autoName = `Buttock ${v.fixed.trim()}`;
      } else if (v.kind === 'diagonal') {
        const originZ = length('the diagonal’s height on the centreline');
        const angle = Number(v.angle.trim().replace(',', '.'));
        if (v.angle.trim() === '' || !Number.isFinite(angle) || angle <= -90 || angle >= 90) {
          ctx.addIssue({ code: 'custom', path: ['angle'], message: `Enter the angle below the horizontal in degrees, between -90 and 90${v.angle.trim() ? `, found "${v.angle.trim()}"` : ''}` });
        }
        spec = { kind: 'diagonal', originZ, angle: degToRad(Number.isFinite(angle) ? angle : 0) };
        autoName = 'Diagonal';
      } else {
        spec = { kind: 'point', role: v.kind };
        autoName = roleNames[v.kind];
      }
      const name = v.name.trim() || autoName.trim();
      if (!name) ctx.addIssue({ code: 'custom', path: ['name'], message: 'Give the line a name' });
      return { name: name.slice(0, 40), spec, knuckle: v.knuckle };
    });
}

/** The form's starting values for an existing line. */
export function lineFormValues(line: Line, notation: Notation): LineFormValues {
  const base = { name: line.name, angle: '', knuckle: line.knuckle !== null };
  switch (line.kind) {
    case 'waterline':
      return { ...base, kind: 'waterline', fixed: lengthFormat(line.z, notation) };
    case 'buttock':
      return { ...base, kind: 'buttock', fixed: lengthFormat(line.y, notation) };
    case 'diagonal':
      return { ...base, kind: 'diagonal', fixed: lengthFormat(line.originZ, notation), angle: String(Number(radToDeg(line.angle).toFixed(3))) };
    case 'point':
      return { ...base, kind: line.role, fixed: '' };
  }
}

/** Add a line, or change one (its kind stays: the cells mean something else in another kind). */
export function LineForm({ notation, initial, fixedKind, submitLabel, onSubmit, onCancel }: { notation: Notation; initial: LineFormValues; fixedKind: boolean; submitLabel: string; onSubmit: (result: LineFormResult) => void; onCancel?: () => void }) {
  const schema = lineFormSchema(notation);
  const {
    register,
    handleSubmit,
    watch,
    reset,
    formState: { errors },
  } = useForm<LineFormValues, unknown, LineFormResult>({ resolver: zodResolver(schema), defaultValues: initial });
  const kind = watch('kind');
  const fixedLabel = kind === 'waterline' ? 'Height of the waterline' : kind === 'buttock' ? 'Half-breadth of the buttock' : kind === 'diagonal' ? 'Height on the centreline where the diagonal starts' : null;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit((result) => {
        onSubmit(result);
        if (!onCancel) reset(initial);
      })}
    >
      <div className="grid grid-cols-1 items-start gap-3 md:grid-cols-2">
        <SelectField label="Kind of line" disabled={fixedKind} error={errors.kind?.message} {...register('kind')}>
          {lineKindChoices.map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
        <InputField label="Line name" hint={fixedKind ? undefined : 'Left empty, it is named from its kind and value, e.g. “WL 300”.'} autoComplete="off" error={errors.name?.message} {...register('name')} />
        {fixedLabel && <InputField label={fixedLabel} inputMode={lengthInputMode(notation)} autoComplete="off" error={errors.fixed?.message} {...register('fixed')} />}
        {kind === 'diagonal' && <InputField label="Angle below the horizontal (degrees)" inputMode="decimal" autoComplete="off" error={errors.angle?.message} {...register('angle')} />}
      </div>
      <label className="flex min-h-12 items-center gap-3">
        <input type="checkbox" className="size-6" {...register('knuckle')} />
        <span>A knuckle: a corner in every section it crosses (usual for sheer, chine and keel)</span>
      </label>
      <div className="flex flex-wrap gap-2">
        <Button type="submit">
          {!onCancel && <Plus aria-hidden="true" className="size-5" />}
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
