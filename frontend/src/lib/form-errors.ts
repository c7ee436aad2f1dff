import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { errorMessage, isApiError } from './api-client';

/**
 * Puts the server's field errors beside their inputs and returns what is left for a form-level
 * message (or null when every error found its field).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  knownFields: ReadonlyArray<Path<T>>,
): string | null {
  if (!isApiError(error) || error.fields.length === 0) return errorMessage(error);
  const unplaced: string[] = [];
  for (const { field, message } of error.fields) {
    const known = knownFields.find((name) => name === field);
    if (known) setError(known, { type: 'server', message });
    else unplaced.push(`${field}: ${message}`);
  }
  if (unplaced.length === 0) return null;
  return [error.message, ...unplaced].join(' ');
}
