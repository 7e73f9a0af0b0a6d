import { median } from './quantile';

/**
 * Tukey's biweight location and scale (F. Mosteller and J. W. Tukey (1977), Data Analysis and Regression,
 * ch. 10; D. A. Lax (1985), JASA 80, 736–741), the estimators of the robust reference-interval method.
 * Location (c = 3.7, the constant Horn & Pesce used for it, from memory): start at the median and iterate
 *   u_i = (x_i − T)/(c·MAD), T ← Σ w_i x_i / Σ w_i with w_i = (1 − u_i²)² for |u_i| < 1, else 0,
 * MAD = median|x − T| about the current T, until T changes by less than 1e-12 of the data's scale.
 * Scale (biweight midvariance, c = 9):
 *   S = sqrt(n · Σ (x_i − T)²(1 − u_i²)⁴) / |Σ (1 − u_i²)(1 − 5u_i²)|, u_i = (x_i − T)/(9·MAD), |u_i| < 1.
 */
export function biweightLocation(values: ArrayLike<number>, c = 3.7): number {
  const n = values.length;
  let t = median(values);
  const scale = Math.max(1e-300, ...Array.from(values, Math.abs));
  for (let round = 0; round < 200; round++) {
    const mad = median(Array.from(values, (v) => Math.abs(v - t)));
    if (mad === 0) return t;
    let sw = 0;
    let swx = 0;
    for (let i = 0; i < n; i++) {
      const u = (values[i] - t) / (c * mad);
      if (Math.abs(u) >= 1) continue;
      const w = (1 - u * u) ** 2;
      sw += w;
      swx += w * values[i];
    }
    const next = swx / sw;
    if (Math.abs(next - t) <= 1e-12 * scale) return next;
    t = next;
  }
  return t;
}

export function biweightScale(values: ArrayLike<number>, location: number, c = 9): number {
  const n = values.length;
  const mad = median(Array.from(values, (v) => Math.abs(v - location)));
  if (mad === 0) return 0;
  let numerator = 0;
  let denominator = 0;
  for (let i = 0; i < n; i++) {
    const u = (values[i] - location) / (c * mad);
    if (Math.abs(u) >= 1) continue;
    const u2 = u * u;
    numerator += (values[i] - location) ** 2 * (1 - u2) ** 4;
    denominator += (1 - u2) * (1 - 5 * u2);
  }
  return Math.sqrt(n * numerator) / Math.abs(denominator);
}
