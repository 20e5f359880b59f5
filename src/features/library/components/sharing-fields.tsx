import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { visibilities, type Visibility } from '../../../../shared/api/library';
import { SelectField, TextareaField } from '../../../components/ui/field';
import { visibilityLabels } from './library-words';

interface SharingValues {
  visibility: Visibility;
  shareWith: string;
}

/** Who may see an item: private, the people named by e-mail, or everyone. */
export function SharingFields<T extends SharingValues>({ register, errors, visibility }: { register: UseFormRegister<T>; errors: FieldErrors<T>; visibility: Visibility }) {
  const reg = register as unknown as UseFormRegister<SharingValues>;
  const errs = errors as FieldErrors<SharingValues>;
  return (
    <fieldset className="flex flex-col gap-4">
      <legend className="mb-2 text-lg font-semibold">Who may see it</legend>
      <SelectField label="Visibility" error={errs.visibility?.message} {...reg('visibility')}>
        {visibilities.map((v) => (
          <option key={v} value={v}>
            {visibilityLabels[v]}
          </option>
        ))}
      </SelectField>
      {visibility === 'shared' && (
        <TextareaField
          label="Share with"
          hint="Their e-mail addresses, one a line or separated by commas. They need not have an account yet."
          rows={3}
          error={errs.shareWith?.message}
          {...reg('shareWith')}
        />
      )}
    </fieldset>
  );
}
