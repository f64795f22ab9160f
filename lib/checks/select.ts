/** Median by selection (Hoare's quickselect) in place: O(n) on average, no allocation. */
export function medianInPlace(a: Float32Array | Float64Array, from: number, to: number): number {
  const n = to - from;
  if (n <= 0) return NaN;
  const mid = from + (n >> 1);
  const hi = select(a, from, to - 1, mid);
  if (n % 2 === 1) return hi;
  // Even count: the lower middle is the largest value left of mid after selection.
  let lo = -Infinity;
  for (let i = from; i < mid; i++) if (a[i] > lo) lo = a[i];
  return (lo + hi) / 2;
}

function select(a: Float32Array | Float64Array, left: number, right: number, k: number): number {
  while (right > left) {
    // Median of three as pivot keeps sorted input (common: smooth branches) linear.
    const m = (left + right) >> 1;
    if (a[m] < a[left]) swap(a, m, left);
    if (a[right] < a[left]) swap(a, right, left);
    if (a[right] < a[m]) swap(a, right, m);
    const pivot = a[m];
    let i = left;
    let j = right;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        swap(a, i, j);
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return a[k];
  }
  return a[k];
}

function swap(a: Float32Array | Float64Array, i: number, j: number) {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}
