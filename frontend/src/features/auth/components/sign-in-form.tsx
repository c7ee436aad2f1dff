import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link } from 'react-router';
import { loginRequestSchema } from '@shared/schemas/auth';
import type { SessionUser } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormMessage, TextField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useLogin } from '../api/login';

type Schema = typeof loginRequestSchema;

export function SignInForm({ onSignedIn, defaultEmail }: { onSignedIn: (user: SessionUser) => void; defaultEmail?: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(loginRequestSchema),
    defaultValues: { email: defaultEmail ?? '', password: '' },
  });
  const { errors } = form.formState;
  const loginMutation = useLogin({ onSuccess: (data) => onSignedIn(data.user) });

  const onSubmit = form.handleSubmit((values) => {
    setFormError(null);
    loginMutation.mutate(values, {
      onError: (error) => setFormError(applyServerErrors(error, form.setError, ['email', 'password'])),
    });
  });

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
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <div className="flex items-center justify-between gap-4">
        <Link to="/forgot-password" className="rounded-sm text-small font-semibold text-frost-600 hover:text-frost-700 hover:underline">
          Forgot your password?
        </Link>
        <Button type="submit" pending={loginMutation.isPending} pendingLabel="Signing in…">
          Sign in
        </Button>
      </div>
    </form>
  );
}
