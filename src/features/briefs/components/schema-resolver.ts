import type { FieldErrors, FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';

export type Conversion = { input: unknown; errors: Record<string, string> };

/**
 * A react-hook-form resolver for forms whose fields are not the API's shape (money typed in major units,
 * a length typed as m:ss): the form values are converted, then checked with the same shared zod schema
 * the server uses, and each message is put back on the field the person typed into.
 */
export function schemaResolver<F extends FieldValues, S extends z.ZodType>(
  schema: S,
  convert: (values: F) => Conversion,
  fieldOf: (apiPath: string, values: F) => string,
): Resolver<F, unknown, z.output<S>> {
  return (values) => {
    const { input, errors: conversionErrors } = convert(values);
    const result = schema.safeParse(input);
    const messages: Record<string, string> = { ...conversionErrors };
    if (!result.success) {
      for (const issue of result.error.issues) {
        const field = fieldOf(issue.path.map(String)[0] ?? '', values);
        messages[field] ??= issue.message;
      }
    }
    if (result.success && Object.keys(messages).length === 0) return { values: result.data, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const [field, message] of Object.entries(messages)) errors[field] = { type: 'validate', message };
    return { values: {}, errors: errors as FieldErrors<F> };
  };
}

/** Server field names (API shape) → form field names, for the messages a 400 carries. */
export function mapServerFields(fields: Record<string, string>, fieldOf: (apiPath: string) => string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [path, message] of Object.entries(fields)) out[fieldOf(path.split('.')[0])] ??= message;
  return out;
}
