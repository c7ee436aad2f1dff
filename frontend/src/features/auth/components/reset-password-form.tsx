import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link } from 'react-router';
import { PASSWORD_MIN_LENGTH, passwordSchema } from '@shared/schemas/common';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { FormMessage, TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';

const newPasswordFormSchema = z
  .object({ password: passwordSchema, confirmPassword: z.string() })
  .refine((values) => values.password === values.confirmPassword, {
    message: 'The two passwords are not the same.',
    path: ['confirmPassword'],
  });
type Schema = typeof newPasswordFormSchema;

export function ResetPasswordForm({ token }: { token: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [invalidToken, setInvalidToken] = useState(false);
  const [done, setDone] = useState(false);
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(newPasswordFormSchema),
    defaultValues: { password: '', confirmPassword: '' },
  });
  const { errors } = form.formState;
  const confirmMutation = useConfirmPasswordReset();

  const onSubmit = form.handleSubmit(({ password }) => {
    setFormError(null);
    confirmMutation.mutate(
      { token, password },
      {
        onSuccess: () => setDone(true),
        onError: (error) => {
          if (isApiError(error) && (error.code === 'invalid_token' || error.fields.some((f) => f.field === 'token'))) {
            setInvalidToken(true);
            return;
          }
          setFormError(applyServerErrors(error, form.setError, ['password']));
        },
      },
    );
  });

  if (done) {
    return (
      <Alert tone="success" title="Your password is changed" action={<ButtonLink to="/sign-in" size="sm">Sign in</ButtonLink>}>
        Sign in with your new password.
      </Alert>
    );
  }

  if (invalidToken) return <InvalidResetLink />;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <FormMessage>{formError}</FormMessage>
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        autoFocus
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <TextField
        label="Repeat the new password"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...form.register('confirmPassword')}
      />
      <Button type="submit" pending={confirmMutation.isPending} pendingLabel="Saving…" className="self-start">
        Set new password
      </Button>
    </form>
  );
}

export function InvalidResetLink() {
  return (
    <Alert tone="caution" title="This link no longer works">
      Reset links work once and expire after a while. <Link to="/forgot-password" className="font-semibold underline">Ask for a new link</Link>.
    </Alert>
  );
}
