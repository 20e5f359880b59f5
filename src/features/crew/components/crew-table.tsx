import { useEffect, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { roles, type CrewMember, type Role } from '../../../../shared/api/hulls';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { ApiError, describeError } from '../../../lib/api-client';
import { roleLabels } from '../../../lib/labels';
import { useChangeCrewRole } from '../api/change-crew-role';
import { useRemoveCrewMember } from '../api/remove-crew-member';

function crewErrorText(error: unknown): string {
  if (error instanceof ApiError && error.code === 'last_owner') {
    return 'A hull needs at least one owner. Make someone else an owner first.';
  }
  return describeError(error);
}

interface RowProps {
  hullId: number;
  member: CrewMember;
  isYou: boolean;
  canManage: boolean;
}

function RoleCell({ hullId, member, isYou }: Omit<RowProps, 'canManage'>) {
  const changeRole = useChangeCrewRole(hullId);
  // While the change is on its way, show what was chosen; the server's answer then takes over.
  const shown: Role = changeRole.isPending ? changeRole.variables.role : member.role;
  return (
    <SelectField
      label={`Role for ${member.displayName}`}
      hideLabel
      value={shown}
      disabled={changeRole.isPending}
      error={changeRole.isError ? crewErrorText(changeRole.error) : undefined}
      hint={isYou && member.role === 'owner' ? 'This is you: give up Owner and you can no longer change the crew.' : undefined}
      onChange={(event) => {
        const role = event.target.value as Role;
        if (role !== member.role) changeRole.mutate({ userId: member.userId, role });
      }}
      className="min-w-40 max-w-60"
    >
      {roles.map((role) => (
        <option key={role} value={role}>
          {roleLabels[role]}
        </option>
      ))}
    </SelectField>
  );
}

function RemoveCell({ hullId, member, isYou }: Omit<RowProps, 'canManage'>) {
  const remove = useRemoveCrewMember(hullId);
  const navigate = useNavigate();
  const [confirming, setConfirming] = useState(false);
  const removeButton = useRef<HTMLButtonElement>(null);
  const wasConfirming = useRef(false);

  // Put the focus back on Remove when the person changes their mind, so a keyboard user is not lost.
  useEffect(() => {
    if (wasConfirming.current && !confirming) removeButton.current?.focus();
    wasConfirming.current = confirming;
  }, [confirming]);

  if (!confirming) {
    return (
      <Button
        ref={removeButton}
        variant="secondary"
        onClick={() => {
          remove.reset();
          setConfirming(true);
        }}
      >
        Remove
      </Button>
    );
  }

  const question = isYou
    ? 'Take yourself off this crew? You will no longer see this hull.'
    : `Take ${member.displayName} off this crew?`;

  return (
    <div className="flex min-w-64 flex-col gap-2" role="group" aria-label={`Confirm removing ${member.displayName}`}>
      <p className="font-medium">{question}</p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant="danger"
          busy={remove.isPending}
          onClick={() => {
            remove.mutate(member.userId, {
              onSuccess: () => {
                if (isYou) void navigate('/hulls', { replace: true });
              },
            });
          }}
        >
          Yes, remove
        </Button>
        <Button variant="secondary" autoFocus disabled={remove.isPending} onClick={() => setConfirming(false)}>
          Keep
        </Button>
      </div>
      {remove.isError && <p className="font-medium text-danger">{crewErrorText(remove.error)}</p>}
    </div>
  );
}

function CrewRow({ hullId, member, isYou, canManage }: RowProps) {
  return (
    <tr className="border-t border-rule align-top">
      <th scope="row" className="px-4 py-3 text-left font-semibold whitespace-nowrap">
        {member.displayName}
        {isYou && <span className="ml-2 font-normal text-muted">(you)</span>}
      </th>
      <td className="px-4 py-3 whitespace-nowrap">{member.email}</td>
      <td className="px-4 py-3">
        {canManage ? <RoleCell hullId={hullId} member={member} isYou={isYou} /> : roleLabels[member.role]}
      </td>
      {canManage && (
        <td className="px-4 py-3">
          <RemoveCell hullId={hullId} member={member} isYou={isYou} />
        </td>
      )}
    </tr>
  );
}

/** The crew, one row per member; an owner gets a role select and a Remove button on each row. */
export function CrewTable({ hullId, hullName, crew, canManage, currentUserId }: { hullId: number; hullName: string; crew: CrewMember[]; canManage: boolean; currentUserId: number | null }) {
  return (
    <div className="relative overflow-x-auto rounded-xl border border-rule bg-surface" role="region" aria-label="Crew list" tabIndex={0}>
      <table className="w-full min-w-[36rem] border-collapse">
        <caption className="sr-only">Crew of {hullName}</caption>
        <thead className="bg-paper text-left">
          <tr>
            <th scope="col" className="px-4 py-3 font-semibold">
              Name
            </th>
            <th scope="col" className="px-4 py-3 font-semibold">
              E-mail
            </th>
            <th scope="col" className="px-4 py-3 font-semibold">
              Role
            </th>
            {canManage && (
              <th scope="col" className="px-4 py-3 font-semibold">
                <span className="sr-only">Changes</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {crew.map((member) => (
            <CrewRow key={member.userId} hullId={hullId} member={member} isYou={member.userId === currentUserId} canManage={canManage} />
          ))}
        </tbody>
      </table>
    </div>
  );
}
