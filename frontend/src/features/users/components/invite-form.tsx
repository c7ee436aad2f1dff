import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ROLES, ROLE_LABELS } from '@shared/schemas/common';
import { createInvitationRequestSchema, INVITATION_VALID_HOURS } from '@shared/schemas/users';
import { Button } from '@/components/ui/button';
import { FormMessage, SelectField, TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateInvitation } from '../api/create-invitation';

type Schema = typeof createInvitationRequestSchema;

export function InviteForm() {
  const [formError, setFormError] = useState<string | null>(null);
  const [sent, setSent] = useState<{ email: string; resent: boolean } | null>(null);
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(createInvitationRequestSchema),
    defaultValues: { email: '', name: '', role: 'designer' },
  });
  const { errors } = form.formState;
  const invite = useCreateInvitation();

  const onSubmit = form.handleSubmit((values) => {
    setFormError(null);
    setSent(null);
    invite.mutate(values, {
      onSuccess: ({ invitation, resent }) => {
        setSent({ email: invitation.email, resent });
        form.reset({ email: '', name: '', role: values.role });
      },
      onError: (error) => {
        if (isApiError(error) && error.status === 409 && error.fields.length === 0) {
          form.setError('email', { type: 'server', message: error.message });
          return;
        }
        setFormError(applyServerErrors(error, form.setError, ['email', 'name', 'role']));
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      {sent && (
        <FormMessage tone="success">
          {sent.resent
            ? `Invitation sent again to ${sent.email}. The earlier link no longer works; the new one works for ${INVITATION_VALID_HOURS} hours.`
            : `Invitation sent to ${sent.email}. The link works for ${INVITATION_VALID_HOURS} hours.`}
        </FormMessage>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      </div>
      <SelectField label="Role" error={errors.role?.message} containerClassName="sm:max-w-xs" {...form.register('role')}>
        {ROLES.map((role) => (
          <option key={role} value={role}>
            {ROLE_LABELS[role]}
          </option>
        ))}
      </SelectField>
      <Button type="submit" pending={invite.isPending} pendingLabel="Sending…" className="self-start">
        Send invitation
      </Button>
    </form>
  );
}
