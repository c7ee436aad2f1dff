import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link } from 'react-router';
import type { SessionUser } from '@shared/schemas/auth';
import { PASSWORD_MIN_LENGTH, ROLE_LABELS, passwordSchema } from '@shared/schemas/common';
import { acceptInvitationRequestSchema } from '@shared/schemas/users';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormMessage, TextField } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationLookup } from '../api/get-invitation-lookup';

const acceptFormSchema = z
  .object({
    name: acceptInvitationRequestSchema.shape.name,
    password: passwordSchema,
    confirmPassword: z.string(),
  })
  .refine((values) => values.password === values.confirmPassword, {
    message: 'The two passwords are not the same.',
    path: ['confirmPassword'],
  });
type Schema = typeof acceptFormSchema;

export function InvalidInvitation() {
  return (
    <Alert tone="caution" title="This invitation no longer works">
      It may have been used already, revoked, or it expired. Ask your workspace administrator to send a new one. Already a
      member? <Link to="/sign-in" className="font-semibold underline">Sign in</Link>.
    </Alert>
  );
}

export function AcceptInvitation({ token, onAccepted }: { token: string; onAccepted: (user: SessionUser) => void }) {
  const lookup = useInvitationLookup(token);

  if (lookup.isPending) return <Loading label="Checking your invitation…" />;
  if (lookup.isError) {
    if (isApiError(lookup.error) && (lookup.error.status === 400 || lookup.error.status === 404)) return <InvalidInvitation />;
    return <QueryError error={lookup.error} onRetry={() => void lookup.refetch()} retrying={lookup.isFetching} />;
  }

  const invitation = lookup.data;
  return (
    <div className="flex flex-col gap-6">
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 rounded-card border border-ink-100 bg-surface p-5 text-small shadow-card">
        <dt className="font-semibold text-ink-500">Workspace</dt>
        <dd className="font-bold text-ink-900">{invitation.workspaceName}</dd>
        <dt className="font-semibold text-ink-500">Your role</dt>
        <dd className="font-bold text-ink-900">{ROLE_LABELS[invitation.role]}</dd>
        <dt className="font-semibold text-ink-500">E-mail</dt>
        <dd className="break-all text-ink-900">{invitation.email}</dd>
      </dl>
      <AcceptForm token={token} defaultName={invitation.name} email={invitation.email} onAccepted={onAccepted} />
    </div>
  );
}

function AcceptForm({
  token,
  defaultName,
  email,
  onAccepted,
}: {
  token: string;
  defaultName: string;
  email: string;
  onAccepted: (user: SessionUser) => void;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const [invalidToken, setInvalidToken] = useState(false);
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(acceptFormSchema),
    defaultValues: { name: defaultName, password: '', confirmPassword: '' },
  });
  const { errors } = form.formState;
  const acceptMutation = useAcceptInvitation({ onSuccess: (data) => onAccepted(data.user) });

  const onSubmit = form.handleSubmit(({ name, password }) => {
    setFormError(null);
    acceptMutation.mutate(
      { token, name, password },
      {
        onError: (error) => {
          if (isApiError(error) && error.code === 'invalid_token') {
            setInvalidToken(true);
            return;
          }
          setFormError(applyServerErrors(error, form.setError, ['name', 'password']));
        },
      },
    );
  });

  if (invalidToken) return <InvalidInvitation />;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <FormMessage>{formError}</FormMessage>
      {/* Lets password managers file the new password under the right address. */}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...form.register('name')} />
      <TextField
        label="Choose a password"
        type="password"
        autoComplete="new-password"
        autoFocus
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <TextField
        label="Repeat the password"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...form.register('confirmPassword')}
      />
      <Button type="submit" pending={acceptMutation.isPending} pendingLabel="Joining…" className="self-start">
        Join the workspace
      </Button>
    </form>
  );
}
