import type { FieldErrors, Resolver } from 'react-hook-form';
import type { Part } from '../../../../../shared/geometry/part-schema';
import { formPathOf, partFormSchema, type PartFormValues } from './part-form-model';

function setIn(target: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split('.');
  let at = target;
  keys.slice(0, -1).forEach((key, i) => {
    const next = keys[i + 1]!;
    if (typeof at[key] !== 'object' || at[key] === null) at[key] = /^\d+$/.test(next) ? [] : {};
    at = at[key] as Record<string, unknown>;
  });
  const last = keys[keys.length - 1]!;
  if (at[last] === undefined) at[last] = value;
}

/**
 * The form's resolver: the thin form schema builds the part and the shared `partSchema` checks it. Each
 * message goes under its field, and all of them into `root.summary` too, since a check across fields
 * (the layers not adding up to the thickness) belongs to no single box.
 */
export function partResolver(previous: Part): Resolver<PartFormValues, unknown, Part> {
  const schema = partFormSchema(previous);
  return async (values) => {
    const parsed = schema.safeParse(values);
    if (parsed.success) return { values: parsed.data, errors: {} };
    const errors: Record<string, unknown> = {};
    for (const issue of parsed.error.issues) setIn(errors, formPathOf(issue.path), { type: issue.code, message: issue.message });
    const messages = [...new Set(parsed.error.issues.map((i) => i.message))];
    errors.root = { summary: { type: 'summary', message: messages.join('\n') } };
    return { values: {}, errors: errors as FieldErrors<PartFormValues> };
  };
}
