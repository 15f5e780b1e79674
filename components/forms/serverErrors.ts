import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../api/client';

/**
 * Puts the server's per-field messages under the matching fields (a field also takes the messages
 * of its nested keys, "fitNotes.device.width" under "fitNotes") and returns the message for the form
 * as a whole, or null when every message found its field.
 */
export function placeServerErrors<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>, known: readonly string[]): string | null {
  if (!(err instanceof ApiError)) return err instanceof Error && err.message ? err.message : 'Something went wrong; check the connection and try again';
  const fields = err.fields ?? {};
  const placed = Object.keys(fields).filter((k) => known.some((n) => k === n || k.startsWith(`${n}.`)));
  for (const k of placed) setError(k as FieldPath<T>, { type: 'server', message: fields[k] });
  return placed.length > 0 && placed.length === Object.keys(fields).length ? null : err.message;
}
