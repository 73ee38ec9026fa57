/** Smallest and largest of the model values y_r (the support of the histogram and of the bucket counts). */
export function valueRange(values: Float64Array): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let r = 0; r < values.length; r++) {
    const y = values[r];
    if (y < min) min = y;
    if (y > max) max = y;
  }
  return { min, max };
}
