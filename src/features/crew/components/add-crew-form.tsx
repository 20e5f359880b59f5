import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { UserPlus } from 'lucide-react';
import { addMemberSchema, roles, type AddMemberInput } from '../../../../shared/api/hulls';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField, SelectField } from '../../../components/ui/field';
import { showServerError, type ErrorWords } from '../../../lib/form-errors';
import { roleLabels } from '../../../lib/labels';
import { useAddCrewMember } from '../api/add-crew-member';

const words: ErrorWords<AddMemberInput> = {
  no_such_account: {
    field: 'email',
    message: 'Nobody has a Loftbench account with this e-mail. Ask them to create an account first, then add them here.',
  },
  already_member: { field: 'email', message: 'This person is already on the crew.' },
};

/** The owner's form to add an existing account to the crew, by e-mail, with a role. */
export function AddCrewForm({ hullId }: { hullId: number }) {
  const addMember = useAddCrewMember(hullId);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<AddMemberInput>({ resolver: zodResolver(addMemberSchema), defaultValues: { email: '', role: 'helper' } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await addMember.mutateAsync(values);
    } catch (error) {
      showServerError(error, setError, ['email', 'role'], words);
      return;
    }
    reset({ email: '', role: values.role });
  });

  const added = addMember.isSuccess ? addMember.data.member : null;

  return (
    <form noValidate onSubmit={onSubmit} aria-labelledby="add-crew-heading" className="flex flex-col gap-4">
      <h3 id="add-crew-heading" className="text-lg font-semibold">
        Add a person by e-mail
      </h3>
      <p className="text-muted">They need a Loftbench account already. Use the e-mail they signed up with.</p>
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      {added && (
        <Alert tone="ok">
          {added.displayName} is on the crew as {roleLabels[added.role]}.
        </Alert>
      )}
      <div className="grid grid-cols-1 items-start gap-4 md:grid-cols-[minmax(0,1fr)_12rem_auto]">
        <InputField label="Crew member's e-mail" type="email" inputMode="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <SelectField label="Role" error={errors.role?.message} {...register('role')}>
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" busy={isSubmitting} className="md:mt-8">
          <UserPlus aria-hidden="true" className="size-5" />
          Add to crew
        </Button>
      </div>
    </form>
  );
}
