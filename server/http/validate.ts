import { z } from 'zod';
import { ValidationError } from './errors';

function path(p: readonly PropertyKey[]): string {
  return p.map((s, i) => (typeof s === 'number' ? `[${s}]` : i === 0 ? String(s) : `.${String(s)}`)).join('');
}

/** Parses a request part with zod (a schema of zod or of zod/mini); the first problem becomes a ValidationError naming its field. */
export function parse<S extends z.core.$ZodType>(schema: S, value: unknown): z.infer<S> {
  const r = z.safeParse(schema, value);
  if (r.success) return r.data;
  const issue = r.error.issues[0];
  const field = path(issue.path) || undefined;
  throw new ValidationError(field ? `${field}: ${issue.message}` : issue.message, field);
}
