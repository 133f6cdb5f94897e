import { isApiError } from './api-error';

/** Field messages keyed by field name, plus one message for the form as a whole. */
export type FormErrors<Field extends string> = {
  fields: Partial<Record<Field, string>>;
  form?: { title: string; detail: string } | undefined;
};

type Issue = { path: ReadonlyArray<PropertyKey>; message: string };

/** Turns a contract schema's issues (checked in the browser before sending) into field messages. */
export function fromSchemaIssues<Field extends string>(
  issues: ReadonlyArray<Issue>,
  fields: ReadonlyArray<Field>,
): FormErrors<Field> {
  const result: FormErrors<Field> = { fields: {} };
  for (const issue of issues) {
    const name = String(issue.path[0] ?? '');
    const field = fields.find((candidate) => candidate === name);
    if (field && result.fields[field] === undefined) result.fields[field] = issue.message;
  }
  return result;
}

/**
 * Turns a failed request into field messages (from problem+json `errors`, paths like
 * `body.email`) and a form message for everything a field cannot show.
 */
export function fromRequestError<Field extends string>(
  error: unknown,
  fields: ReadonlyArray<Field>,
  /** Titles for the form message by status, where a form knows better words than the server's. */
  titles: Partial<Record<number, string>> = {},
): FormErrors<Field> {
  if (!isApiError(error)) {
    return { fields: {}, form: { title: 'Something went wrong', detail: 'Try again in a moment.' } };
  }
  const result: FormErrors<Field> = { fields: {} };
  for (const field of fields) {
    const message = error.messageFor(field);
    if (message) result.fields[field] = message;
  }
  const unplaced = error.fieldErrors.some(
    (fieldError) => !fields.some((field) => fieldError.path === field || fieldError.path.endsWith(`.${field}`)),
  );
  if (error.fieldErrors.length === 0 || unplaced) {
    result.form = { title: titles[error.status] ?? titleFor(error.status, error.title), detail: error.detail };
  }
  return result;
}

function titleFor(status: number, fallback: string): string {
  if (status === 401) return 'Not signed in';
  if (status === 429) return 'Too many attempts';
  if (status === 0) return 'No connection';
  return fallback;
}
