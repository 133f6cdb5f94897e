import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-error';

/**
 * Puts the api's problem+json field errors (`body.sites.0.addressLines`) on the matching
 * react-hook-form fields (`sites.0.addressLines`). Returns the form-level message for whatever
 * a field cannot show (a 409 conflict, a lost connection), or undefined when every error found
 * its field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  knownFields: (path: string) => boolean,
): { title: string; detail: string } | undefined {
  if (!isApiError(error)) return { title: 'Something went wrong', detail: 'Try again in a moment.' };
  let unplaced = error.fieldErrors.length === 0;
  for (const fieldError of error.fieldErrors) {
    const path = fieldError.path.replace(/^body\./, '');
    if (knownFields(path)) setError(path as Path<T>, { type: 'server', message: fieldError.message }, { shouldFocus: true });
    else unplaced = true;
  }
  if (!unplaced) return undefined;
  const title = error.status === 409 ? 'Changed by someone else' : error.status === 0 ? 'No connection' : error.title;
  return { title, detail: error.detail };
}
