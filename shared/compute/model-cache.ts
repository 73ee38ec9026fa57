import { compileModel, type CompiledModel, type ModelSpec } from '../model/compile-model';

const CAPACITY = 32;
const cache = new Map<string, CompiledModel>();

/**
 * compileModel with a small least-recently-used cache keyed by everything the
 * compiled code depends on (model text, symbols, units, constant values), so
 * a budget recomputed on every keystroke of an estimate does not re-parse or
 * re-differentiate its model.
 */
export function compileCached(spec: ModelSpec): CompiledModel {
  const key = JSON.stringify([spec.model, spec.measurand.symbol, spec.measurand.unit ?? '', spec.inputs, spec.constants]);
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const compiled = compileModel(spec);
  cache.set(key, compiled);
  if (cache.size > CAPACITY) cache.delete(cache.keys().next().value as string);
  return compiled;
}
