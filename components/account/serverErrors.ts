import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../api/client';

/**
 * Puts the server's field messages under the matching fields and returns the message for the
 * form as a whole (or null when every message found its field).
 */
export function showServerErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>, fields: readonly Path<T>[]): string | null {
  if (!(err instanceof ApiError)) return 'Something went wrong; check the connection and try again';
  let placed = 0;
  for (const [key, message] of Object.entries(err.fields ?? {})) {
    if ((fields as readonly string[]).includes(key)) {
      setError(key as Path<T>, { type: 'server', message });
      placed++;
    }
  }
  return placed > 0 && placed === Object.keys(err.fields ?? {}).length ? null : err.message;
}
