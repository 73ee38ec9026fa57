/**
 * Typed arrays kept from one Monte Carlo run to the next on this thread,
 * one per named use (the input columns of a block, the model values, the
 * buffers of the interval search and its sorts): a fresh array costs page
 * faults and zeroing when first written and garbage collection when dropped;
 * a kept one costs neither. Arrays above
 * KEPT_BYTES are not kept, so a 10⁷-trial run leaves no large buffer behind.
 * A kept array is NOT zeroed: its user writes every element it reads. Two
 * users must not hold the same name at once (JavaScript runs one run at a
 * time per thread; the uses are named by the one function that holds them).
 */
const KEPT_BYTES = 16 * 2 ** 20;
const kept = new Map<string, ArrayBuffer>();

function keptBuffer(use: string, bytes: number): ArrayBuffer | null {
  if (bytes > KEPT_BYTES) return null;
  let buffer = kept.get(use);
  if (buffer === undefined || buffer.byteLength < bytes) {
    buffer = new ArrayBuffer(bytes);
    kept.set(use, buffer);
  }
  return buffer;
}

/** A Float64Array of `length` for `use`, kept across runs when small enough; its contents are left from the last use. */
export function scratchFloat64(use: string, length: number): Float64Array {
  const buffer = keptBuffer(use, 8 * length);
  return buffer ? new Float64Array(buffer, 0, length) : new Float64Array(length);
}

/** An Int32Array of `length` for `use`, as scratchFloat64. */
export function scratchInt32(use: string, length: number): Int32Array {
  const buffer = keptBuffer(use, 4 * length);
  return buffer ? new Int32Array(buffer, 0, length) : new Int32Array(length);
}

/** A Uint32Array of `length` for `use`, as scratchFloat64. */
export function scratchUint32(use: string, length: number): Uint32Array {
  const buffer = keptBuffer(use, 4 * length);
  return buffer ? new Uint32Array(buffer, 0, length) : new Uint32Array(length);
}
