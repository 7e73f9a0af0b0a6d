/**
 * k-th smallest value (0-based) by Hoare's quickselect with median-of-three pivots
 * (C. A. R. Hoare (1961), "Algorithm 65: Find", Comm. ACM 4(7), 321–322).
 * Reorders buf[0..length) in place; used on scratch buffers only.
 * @throws RangeError if k is outside 0..length-1
 */
export function selectInPlace(buf: Float64Array, length: number, k: number): number {
  if (!(k >= 0 && k < length)) throw new RangeError('selectInPlace requires 0 <= k < length');
  let left = 0;
  let right = length - 1;
  while (right > left) {
    const mid = (left + right) >> 1;
    if (buf[mid] < buf[left]) swap(buf, mid, left);
    if (buf[right] < buf[left]) swap(buf, right, left);
    if (buf[right] < buf[mid]) swap(buf, right, mid);
    const pivot = buf[mid];
    let i = left;
    let j = right;
    while (i <= j) {
      while (buf[i] < pivot) i++;
      while (buf[j] > pivot) j--;
      if (i <= j) swap(buf, i++, j--);
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return buf[k];
  }
  return buf[k];
}

/** Median of buf[0..length) by selection (reorders the buffer). */
export function medianInPlace(buf: Float64Array, length: number): number {
  const half = length >> 1;
  const upper = selectInPlace(buf, length, half);
  if (length % 2 === 1) return upper;
  let lower = -Infinity;
  for (let i = 0; i < half; i++) if (buf[i] > lower) lower = buf[i];
  return (lower + upper) / 2;
}

function swap(buf: Float64Array, a: number, b: number): void {
  const t = buf[a];
  buf[a] = buf[b];
  buf[b] = t;
}
