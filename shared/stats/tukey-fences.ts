import { quantileSorted } from './quantile';

/**
 * Tukey's fences (J. W. Tukey (1977), Exploratory Data Analysis): flag values below Q1 − 1.5·IQR or above
 * Q3 + 1.5·IQR, with Q1 and Q3 the definition-6 quartiles (quantile.ts). Flags only.
 * @returns the fences and the indexes (into values) outside them
 */
export function tukeyFences(values: ArrayLike<number>): { lowerFence: number; upperFence: number; indexes: number[] } {
  const sorted = Float64Array.from(values).sort();
  const q1 = quantileSorted(sorted, 0.25);
  const q3 = quantileSorted(sorted, 0.75);
  const lowerFence = q1 - 1.5 * (q3 - q1);
  const upperFence = q3 + 1.5 * (q3 - q1);
  const indexes: number[] = [];
  for (let i = 0; i < values.length; i++) if (values[i] < lowerFence || values[i] > upperFence) indexes.push(i);
  return { lowerFence, upperFence, indexes };
}
