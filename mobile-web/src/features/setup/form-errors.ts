/**
 * Field messages for the setting-up forms: the same shared schema checks the form before it is
 * sent and the server after, and both answers land on the field they are about.
 */
import { ApiError } from '../../api/http';

/** A message per field path, e.g. `{ "liftHeightsM.2": "More than 0 m" }`; `''` is the form as a whole. */
export type FieldErrors = Record<string, string>;

interface IssueLike {
  path?: readonly PropertyKey[];
  message?: string;
}

/** The first message per path of zod or server issues. */
export function fieldErrorsOf(issues: readonly IssueLike[] | undefined): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of issues ?? []) {
    const key = (issue.path ?? []).map(String).join('.');
    if (issue.message && !(key in errors)) errors[key] = issue.message;
  }
  return errors;
}

/** Field messages of a refused request, or the request's own message under `''`. */
export function fieldErrorsOfError(error: unknown): FieldErrors {
  if (error instanceof ApiError) {
    const issues = Array.isArray(error.issues) ? fieldErrorsOf(error.issues as IssueLike[]) : {};
    return Object.keys(issues).length > 0 ? issues : { '': error.message };
  }
  return { '': error instanceof Error ? error.message : 'Something went wrong; try again.' };
}

/** The message for a field or any part of it (`lifts` also shows `lifts.0`'s). */
export function errorFor(errors: FieldErrors, path: string): string | undefined {
  if (errors[path]) return errors[path];
  const nested = Object.keys(errors).find((key) => key.startsWith(`${path}.`));
  return nested ? errors[nested] : undefined;
}
