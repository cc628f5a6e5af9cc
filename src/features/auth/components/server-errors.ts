import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from '@/lib/api-client';

/**
 * Puts the server's field messages beside the matching fields and returns what is left for a form-level
 * alert: the message of an error without fields, or of fields this form does not show.
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, formFields: ReadonlyArray<Path<T>>): string | null {
  if (!isApiError(error)) return error instanceof Error ? error.message : 'Something went wrong. Please try again.';
  const leftovers: string[] = [];
  for (const [field, message] of Object.entries(error.fields)) {
    // Zod paths of array items come back as "roles.0": they belong to the group's field.
    const base = field.split('.')[0] as Path<T>;
    if (formFields.includes(base)) setError(base, { type: 'server', message });
    else leftovers.push(message);
  }
  if (Object.keys(error.fields).length === 0) return error.message;
  return leftovers.length ? leftovers.join(' ') : null;
}
