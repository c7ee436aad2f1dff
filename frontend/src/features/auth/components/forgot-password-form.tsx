import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { passwordResetRequestSchema } from '@shared/schemas/auth';
import { PASSWORD_RESET_VALID_HOURS } from '@shared/schemas/users';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormMessage, TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

type Schema = typeof passwordResetRequestSchema;

/** Answers with the same words whatever the address, so nobody can learn who has an account. */
export function ForgotPasswordForm() {
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });
  const { errors } = form.formState;
  const resetMutation = useRequestPasswordReset();

  const onSubmit = form.handleSubmit((values) => {
    setFormError(null);
    resetMutation.mutate(values, {
      onSuccess: () => setSentTo(values.email),
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['email'])),
    });
  });

  if (sentTo) {
    const hours = PASSWORD_RESET_VALID_HOURS;
    return (
      <Alert tone="success" title="Check your mail">
        If an account uses <strong>{sentTo}</strong>, we have sent it a link to choose a new password. The link works once
        and for {hours === 1 ? 'one hour' : `${hours} hours`}.
      </Alert>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <FormMessage>{formError}</FormMessage>
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        autoFocus
        error={errors.email?.message}
        {...form.register('email')}
      />
      <Button type="submit" pending={resetMutation.isPending} pendingLabel="Sending…" className="self-start">
        Send me a reset link
      </Button>
    </form>
  );
}
