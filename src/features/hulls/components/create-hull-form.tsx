import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { createHullSchema, hullUnitsSchema } from '../../../../shared/api/hulls';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ButtonLink } from '../../../components/ui/button-link';
import { InputField, SelectField, TextareaField } from '../../../components/ui/field';
import { showServerError } from '../../../lib/form-errors';
import { unitsLabels } from '../../../lib/labels';
import { useCreateHull } from '../api/create-hull';

export function CreateHullForm() {
  const navigate = useNavigate();
  const createHull = useCreateHull();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(createHullSchema), defaultValues: { name: '', units: 'mm', notes: '' } });

  const onSubmit = handleSubmit(async (values) => {
    let hullId: number;
    try {
      hullId = (await createHull.mutateAsync(values)).hull.id;
    } catch (error) {
      showServerError(error, setError, ['name', 'units', 'notes']);
      return;
    }
    await navigate(`/hulls/${hullId}`);
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="Hull name" hint="What you call this boat, e.g. the design's name and your hull number." autoComplete="off" error={errors.name?.message} {...register('name')} />
      <SelectField
        label="Units"
        hint="How the table of offsets is written. Loftbench works in millimetres inside and shows the hull in these units."
        error={errors.units?.message}
        {...register('units')}
      >
        {hullUnitsSchema.options.map((units) => (
          <option key={units} value={units}>
            {unitsLabels[units]}
          </option>
        ))}
      </SelectField>
      <TextareaField label="Notes" hint="Optional: designer, plan set, anything the crew should know." rows={4} error={errors.notes?.message} {...register('notes')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={isSubmitting}>
          Create hull
        </Button>
        <ButtonLink to="/hulls" variant="secondary">
          Cancel
        </ButtonLink>
      </div>
    </form>
  );
}
