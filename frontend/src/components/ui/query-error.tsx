import { errorMessage } from '@/lib/api-client';
import { Alert } from './alert';
import { Button } from './button';

/** The error state for a failed query, with a retry. */
export function QueryError({
  error,
  title = 'This could not be loaded',
  onRetry,
  retrying = false,
}: {
  error: unknown;
  title?: string;
  onRetry?: () => void;
  retrying?: boolean;
}) {
  return (
    <Alert
      tone="danger"
      title={title}
      action={
        onRetry && (
          <Button variant="secondary" size="sm" onClick={onRetry} pending={retrying}>
            Try again
          </Button>
        )
      }
    >
      {errorMessage(error)}
    </Alert>
  );
}
