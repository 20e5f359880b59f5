import type { FieldErrors } from 'react-hook-form';
import { camberRevisionSchema, sharingSchema, type CamberRevisionInput, type SharingInput, type Visibility } from '../../../../shared/api/library';
import { camberIssues } from '../../../../shared/geometry/camber';
import type { Camber } from '../../../../shared/geometry/camber-schema';

/** The camber form as typed: numbers stay text until the form is sent, so what was typed is never lost. */
export interface CamberFormValues {
  name: string;
  notes: string;
  rules: string;
  shape: Camber['shape'];
  crownKind: Camber['crown']['kind'];
  riseMm: string;
  referenceBeamMm: string;
  percent: string;
  inchesPerFoot: string;
  convention: Camber['convention'];
  /** Own points, one a line: across (t), then height (h). */
  points: string;
  visibility: Visibility;
  /** E-mail addresses, one a line or separated by commas. */
  shareWith: string;
}

export type CamberFormField = keyof CamberFormValues;

export const emptyCamberForm: CamberFormValues = {
  name: '',
  notes: '',
  rules: '',
  shape: 'parabola',
  crownKind: 'rise',
  riseMm: '',
  referenceBeamMm: '',
  percent: '',
  inchesPerFoot: '',
  convention: 'one-pattern',
  points: '0, 1\n1, 0',
  visibility: 'private',
  shareWith: '',
};

/** The form filled from a published curve (for its next revision). */
export function camberFormFrom(revision: { name: string; notes: string; rules: string; document: Camber }): CamberFormValues {
  const c = revision.document;
  return {
    ...emptyCamberForm,
    name: revision.name,
    notes: revision.notes,
    rules: revision.rules,
    shape: c.shape,
    crownKind: c.crown.kind,
    riseMm: c.crown.kind === 'rise' ? String(c.crown.riseMm) : '',
    referenceBeamMm: c.crown.kind === 'rise' ? String(c.crown.referenceBeamMm) : '',
    percent: c.crown.kind === 'percent-of-beam' ? String(c.crown.percent) : '',
    inchesPerFoot: c.crown.kind === 'per-foot' ? String(c.crown.inchesPerFoot) : '',
    convention: c.convention,
    points: c.points.length ? c.points.map((p) => `${p.t}, ${p.h}`).join('\n') : emptyCamberForm.points,
  };
}

export type CamberFormResult = { ok: true; revision: CamberRevisionInput; sharing: SharingInput } | { ok: false; errors: Partial<Record<CamberFormField, string>> };

/** The form field for a path the server names (`revision.document.points[0]`, `document.crown.riseMm`, `sharing.shareWith`). */
export function camberFieldOfServerPath(path: string, crownKind: Camber['crown']['kind']): CamberFormField | null {
  const parts = path.replace(/\[\d+\]/g, '').split('.').filter(Boolean);
  if (parts[0] === 'sharing') return parts[1] === 'visibility' ? 'visibility' : 'shareWith';
  const rest = parts[0] === 'revision' ? parts.slice(1) : parts;
  if (rest.length === 0 || !['name', 'notes', 'rules', 'document'].includes(rest[0]!)) return null;
  return formFieldOf(rest, crownKind);
}

/** Where a field of the document is typed in this form. */
function formFieldOf(path: readonly PropertyKey[], crownKind: Camber['crown']['kind']): CamberFormField {
  const [head, ...rest] = path.map(String);
  if (head === 'name' || head === 'notes' || head === 'rules') return head;
  const [part, field] = head === 'document' ? rest : [head, ...rest];
  if (part === 'points' || part?.startsWith('points')) return 'points';
  if (part === 'crown') {
    if (field === 'riseMm' || field === 'referenceBeamMm' || field === 'percent' || field === 'inchesPerFoot') return field;
    return crownKind === 'rise' ? 'riseMm' : crownKind === 'percent-of-beam' ? 'percent' : 'inchesPerFoot';
  }
  if (part === 'shape' || part === 'convention') return part;
  return 'name';
}

/**
 * The form as the request body the shared schema accepts, or the problems under the fields they belong
 * to: numbers that are not numbers, points that are not two numbers a line, then the shared schema,
 * then the camber's own checks (`camberIssues`, the same the server runs).
 */
export function camberFormToInput(values: CamberFormValues, withSharing: boolean): CamberFormResult {
  const errors: Partial<Record<CamberFormField, string>> = {};
  const number = (field: 'riseMm' | 'referenceBeamMm' | 'percent' | 'inchesPerFoot', what: string): number => {
    const text = values[field].trim().replace(',', '.');
    if (!text) {
      errors[field] = `Enter ${what}`;
      return NaN;
    }
    const n = Number(text);
    if (!Number.isFinite(n)) errors[field] = `${what[0]!.toUpperCase()}${what.slice(1)} must be a number; “${values[field]}” is not one`;
    return n;
  };
  const crown: Camber['crown'] =
    values.crownKind === 'rise'
      ? { kind: 'rise', riseMm: number('riseMm', 'the rise in mm'), referenceBeamMm: number('referenceBeamMm', 'the beam in mm') }
      : values.crownKind === 'percent-of-beam'
        ? { kind: 'percent-of-beam', percent: number('percent', 'the percentage') }
        : { kind: 'per-foot', inchesPerFoot: number('inchesPerFoot', 'the inches per foot') };

  const points: { t: number; h: number }[] = [];
  if (values.shape === 'custom') {
    values.points
      .split('\n')
      .map((line) => line.trim())
      .forEach((line, i) => {
        if (!line || errors.points) return;
        const parts = line.split(/[\s;]+|,\s*/).filter(Boolean).map(Number);
        if (parts.length !== 2 || parts.some((n) => !Number.isFinite(n))) errors.points = `Line ${i + 1}: give two numbers, across then height; “${line}” is not that`;
        else points.push({ t: parts[0]!, h: parts[1]! });
      });
  }
  const document: Camber = { shape: values.shape, points, crown, convention: values.convention };
  if (Object.keys(errors).length) {
    // Say everything at once: the name and the texts are checked even when a number is not one.
    const texts = camberRevisionSchema.pick({ name: true, notes: true, rules: true }).safeParse(values);
    if (!texts.success) for (const issue of texts.error.issues) errors[formFieldOf(issue.path, values.crownKind)] ??= issue.message;
    return { ok: false, errors };
  }

  const revision = { name: values.name, notes: values.notes, rules: values.rules, document };
  const parsed = camberRevisionSchema.safeParse(revision);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) errors[formFieldOf(issue.path, values.crownKind)] ??= issue.message;
    return { ok: false, errors };
  }
  for (const issue of camberIssues(parsed.data.document)) {
    errors[formFieldOf((issue.field ?? '').replace(/\[\d+\]/g, '').split('.'), values.crownKind)] ??= issue.message;
  }
  const sharing = { visibility: values.visibility, shareWith: splitEmails(values.shareWith) };
  if (withSharing) {
    const shared = sharingSchema.safeParse(sharing);
    if (!shared.success) {
      const issue = shared.error.issues[0]!;
      const index = typeof issue.path[1] === 'number' ? issue.path[1] : null;
      errors.shareWith = index === null ? issue.message : `“${sharing.shareWith[index]}” is not an e-mail address`;
    }
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, revision, sharing };
}

export function splitEmails(text: string): string[] {
  return text
    .split(/[\s,;]+/)
    .map((e) => e.trim())
    .filter(Boolean);
}

/** The same problems as react-hook-form wants them. */
export function asFieldErrors<T extends string>(errors: Partial<Record<T, string>>): FieldErrors {
  return Object.fromEntries(Object.entries(errors).map(([field, message]) => [field, { type: 'validate', message }])) as FieldErrors;
}
