import { budgetDocumentSchema, constantSchema, correlationSchema, distributionSchema, monteCarloSchema, quantitySchema } from '../../shared/budget/schema';
import { ValidationError } from '../http/errors';

/**
 * Shape limits of a budget document, checked before anything walks it
 * recursively (validation, hashing, the copy to a compute worker). The
 * budget file keeps fields it does not know; these limits keep such fields
 * from carrying unbounded data.
 */
export const DOCUMENT_LIMITS = {
  /** Arrays and objects inside one another; a budget needs about 5. */
  depth: 32,
  /** JSON size in bytes (UTF-8) of all unknown fields of one document together. */
  unknownFieldBytes: 64 * 1024,
} as const;

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const keys = (shape: object) => new Set(Object.keys(shape));

const DOCUMENT_KEYS = keys(budgetDocumentSchema.shape);
const MEASURAND_KEYS = keys(budgetDocumentSchema.shape.measurand.shape);
const QUANTITY_KEYS = keys(quantitySchema.shape);
const CONSTANT_KEYS = keys(constantSchema.shape);
const CORRELATION_KEYS = keys(correlationSchema.shape);
const MONTE_CARLO_KEYS = keys(monteCarloSchema.shape);
const DISTRIBUTION_KEYS = new Set(distributionSchema.options.flatMap((o) => Object.keys(o.shape)));

/** Nesting depth of a JSON value without recursion (a value nested 10 000 deep must not overflow the stack here). */
function exceedsDepth(value: unknown, limit: number): boolean {
  const stack: Array<[unknown, number]> = [[value, 1]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (typeof v !== 'object' || v === null) continue;
    if (depth > limit) return true;
    for (const child of Array.isArray(v) ? v : Object.values(v)) {
      if (typeof child === 'object' && child !== null) stack.push([child, depth + 1]);
    }
  }
  return false;
}

/** The fields of `o` outside `known`, as [path, value]. */
function unknownOf(o: unknown, known: Set<string>, path: string): Array<[string, unknown]> {
  if (!isObj(o)) return [];
  return Object.entries(o)
    .filter(([k]) => !known.has(k))
    .map(([k, v]) => [path ? `${path}.${k}` : k, v]);
}

function unknownFields(doc: Obj): Array<[string, unknown]> {
  const each = (list: unknown, known: Set<string>, name: string) => (Array.isArray(list) ? list.flatMap((o, i) => unknownOf(o, known, `${name}[${i}]`)) : []);
  const inputs = Array.isArray(doc.inputs) ? doc.inputs : [];
  return [
    ...unknownOf(doc, DOCUMENT_KEYS, ''),
    ...unknownOf(doc.measurand, MEASURAND_KEYS, 'measurand'),
    ...unknownOf(doc.monteCarlo, MONTE_CARLO_KEYS, 'monteCarlo'),
    ...each(doc.inputs, QUANTITY_KEYS, 'inputs'),
    ...inputs.flatMap((q, i) => (isObj(q) ? unknownOf(q.distribution, DISTRIBUTION_KEYS, `inputs[${i}].distribution`) : [])),
    ...each(doc.constants, CONSTANT_KEYS, 'constants'),
    ...each(doc.correlations, CORRELATION_KEYS, 'correlations'),
  ];
}

/**
 * Refuses (400) a document nested deeper than `DOCUMENT_LIMITS.depth` or
 * whose unknown fields together exceed `DOCUMENT_LIMITS.unknownFieldBytes`
 * of JSON; the message names the limit and, for the size, the largest field.
 */
export function checkDocumentShape(value: unknown, limits: { depth: number; unknownFieldBytes: number } = DOCUMENT_LIMITS): void {
  if (exceedsDepth(value, limits.depth)) {
    throw new ValidationError(`document: arrays and objects are nested more than ${limits.depth} levels deep; a budget file needs far fewer`, 'document', 'too_deep');
  }
  if (!isObj(value)) return;
  let total = 0;
  let largest: [string, number] = ['', 0];
  for (const [path, v] of unknownFields(value)) {
    const bytes = Buffer.byteLength(JSON.stringify(v) ?? '') + Buffer.byteLength(path);
    total += bytes;
    if (bytes > largest[1]) largest = [path, bytes];
  }
  if (total > limits.unknownFieldBytes) {
    throw new ValidationError(
      `document: fields outside the budget format take ${total} bytes, more than the ${limits.unknownFieldBytes} allowed (the largest is "${largest[0]}", ${largest[1]} bytes); remove them or keep such data elsewhere`,
      largest[0],
      'unknown_fields_too_large',
    );
  }
}
