/**
 * q-quantile (0–1, nearest rank) of the first `count` values, by quickselect on a copy: O(n), where a sort
 * of the few hundred thousand samples the ink model uses would dominate the whole run.
 */
export function quantile(values: Float32Array, q: number, count = values.length): number {
  if (count <= 0) return 0;
  const a = values.slice(0, count);
  const target = Math.min(count - 1, Math.max(0, Math.round(q * (count - 1))));
  let low = 0;
  let high = count - 1;
  while (high > low) {
    const pivot = a[(low + high) >> 1];
    let i = low;
    let j = high;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (target <= j) high = j;
    else if (target >= i) low = i;
    else break;
  }
  return a[target];
}
