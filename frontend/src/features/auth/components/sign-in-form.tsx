import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link } from 'react-router';
import { loginRequestSchema } from '@shared/schemas/auth';
import type { SessionUser } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormMessage, TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useLogin } from '../api/login';

type Schema = typeof loginRequestSchema;

/** The wait after too many failed sign-ins, in the server's seconds, with minutes beside long waits. */
function retryMessage(seconds: number): string {
  const unit = seconds === 1 ? 'second' : 'seconds';
  const minutes = seconds >= 90 ? ` (about ${Math.round(seconds / 60)} minutes)` : '';
  return `Too many failed sign-in attempts for this address or from this network. Try again in ${seconds} ${unit}${minutes}.`;
}

/** Counts the server's Retry-After down once a second: [seconds left or null, start, clear]. */
function useCountdown(): [number | null, (seconds: number) => void, () => void] {
  const [clock, setClock] = useState<{ until: number; now: number } | null>(null);
  useEffect(() => {
    if (clock === null || clock.now >= clock.until) return;
    const timer = window.setTimeout(() => setClock((c) => (c ? { ...c, now: Date.now() } : c)), 1000);
    return () => window.clearTimeout(timer);
  }, [clock]);
  const left = clock ? Math.ceil((clock.until - clock.now) / 1000) : 0;
  const start = (seconds: number) => {
    const now = Date.now();
    setClock({ until: now + seconds * 1000, now });
  };
  return [left > 0 ? left : null, start, () => setClock(null)];
}

export function SignInForm({ onSignedIn, defaultEmail }: { onSignedIn: (user: SessionUser) => void; defaultEmail?: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [secondsLeft, startCountdown, clearCountdown] = useCountdown();
  const form = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(loginRequestSchema),
    defaultValues: { email: defaultEmail ?? '', password: '' },
  });
  const { errors } = form.formState;
  const loginMutation = useLogin({ onSuccess: (data) => onSignedIn(data.user) });

  const onSubmit = form.handleSubmit((values) => {
    setFormError(null);
    clearCountdown();
    loginMutation.mutate(values, {
      onError: (error) => {
        if (isApiError(error) && error.status === 429 && error.retryAfterSeconds) {
          startCountdown(error.retryAfterSeconds);
          return;
        }
        setFormError(applyServerErrors(error, form.setError, ['email', 'password']));
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <FormMessage>{secondsLeft !== null ? retryMessage(secondsLeft) : formError}</FormMessage>
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
        <Button type="submit" pending={loginMutation.isPending} pendingLabel="Signing in…" disabled={secondsLeft !== null}>
          Sign in
        </Button>
      </div>
    </form>
  );
}
