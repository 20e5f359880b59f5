import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { roles, type Role } from '../../../shared/api/hulls';
import { showServerError, type ErrorWords } from '../../lib/form-errors';
import { roleLabels } from '../../lib/labels';
import { Alert } from '../ui/alert';
import { Button } from '../ui/button';
import { InputField, SelectField } from '../ui/field';

/** What an e-mail-and-role form sends: adding an account to the crew, or inviting someone. */
export interface EmailRoleInput {
  email: string;
  role: Role;
}

export interface EmailRoleFormProps {
  /** The shared request schema the server validates the same body with. */
  schema: z.ZodType<EmailRoleInput, EmailRoleInput>;
  heading: { id: string; text: string; level: 2 | 3 };
  intro: string;
  emailLabel: string;
  roleLabel: string;
  submit: { label: string; icon: ReactNode };
  /** The form's own words for the error codes it expects. */
  words: ErrorWords<EmailRoleInput>;
  /** Sends the values; resolves to the words that say it worked. */
  send: (values: EmailRoleInput) => Promise<ReactNode>;
}

/**
 * One person by e-mail, with a role on the hull: the owner's form both for adding an account to the crew
 * and for inviting someone who may have none. After a success the e-mail is cleared and the role kept, for
 * the next person of the same kind.
 */
export function EmailRoleForm({ schema, heading, intro, emailLabel, roleLabel, submit, words, send }: EmailRoleFormProps) {
  const [done, setDone] = useState<ReactNode>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<EmailRoleInput>({ resolver: zodResolver(schema), defaultValues: { email: '', role: 'helper' } });

  const onSubmit = handleSubmit(async (values) => {
    setDone(null);
    try {
      setDone(await send(values));
    } catch (error) {
      showServerError(error, setError, ['email', 'role'], words);
      return;
    }
    reset({ email: '', role: values.role });
  });

  const Heading = heading.level === 2 ? 'h2' : 'h3';
  return (
    <form noValidate onSubmit={onSubmit} aria-labelledby={heading.id} className="flex flex-col gap-4">
      <Heading id={heading.id} className={heading.level === 2 ? 'text-xl font-bold' : 'text-lg font-semibold'}>
        {heading.text}
      </Heading>
      <p className="text-muted">{intro}</p>
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      {done && <Alert tone="ok">{done}</Alert>}
      <div className="grid grid-cols-1 items-start gap-4 md:grid-cols-[minmax(0,1fr)_12rem_auto]">
        <InputField label={emailLabel} type="email" inputMode="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <SelectField label={roleLabel} error={errors.role?.message} {...register('role')}>
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" busy={isSubmitting} className="md:mt-8">
          {submit.icon}
          {submit.label}
        </Button>
      </div>
    </form>
  );
}
