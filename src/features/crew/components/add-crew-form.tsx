import { UserPlus } from 'lucide-react';
import { addMemberSchema } from '../../../../shared/api/hulls';
import { EmailRoleForm, type EmailRoleFormProps } from '../../../components/forms/email-role-form';
import { roleLabels } from '../../../lib/labels';
import { useAddCrewMember } from '../api/add-crew-member';

const words: EmailRoleFormProps['words'] = {
  no_such_account: {
    field: 'email',
    message: 'Nobody has a Loftbench account with this e-mail. Ask them to create an account first, then add them here.',
  },
  already_member: { field: 'email', message: 'This person is already on the crew.' },
};

/** The owner's form to add an existing account to the crew, by e-mail, with a role. */
export function AddCrewForm({ hullId }: { hullId: number }) {
  const addMember = useAddCrewMember(hullId);
  return (
    <EmailRoleForm
      schema={addMemberSchema}
      heading={{ id: 'add-crew-heading', text: 'Add a person by e-mail', level: 3 }}
      intro="They need a Loftbench account already. Use the e-mail they signed up with."
      emailLabel="Crew member's e-mail"
      roleLabel="Role"
      submit={{ label: 'Add to crew', icon: <UserPlus aria-hidden="true" className="size-5" /> }}
      words={words}
      send={async (values) => {
        const { member } = await addMember.mutateAsync(values);
        return `${member.displayName} is on the crew as ${roleLabels[member.role]}.`;
      }}
    />
  );
}
