/** Stated limits; a missing one (null) bounds nothing, so an open-ended interval ("below 5.0") has one. */
export interface StatedLimits {
  lower: number | null;
  upper: number | null;
}

/**
 * Where a value falls against stated limits: 'below' the lower, 'above' the upper, or null inside. The limits
 * belong to the interval (a value equal to a limit is inside: outside means strictly below or strictly above),
 * and a missing limit never puts a value outside. The one rule of the engine's count, the screen's strip plot,
 * the PDF's strip plot and the grid positions the server marks.
 */
export function sideOfStated(value: number, stated: StatedLimits): 'below' | 'above' | null {
  if (stated.lower !== null && value < stated.lower) return 'below';
  if (stated.upper !== null && value > stated.upper) return 'above';
  return null;
}

/** Whether a value lies outside stated limits (sideOfStated: strictly beyond a limit that is given). */
export const outsideStated = (value: number, stated: StatedLimits): boolean => sideOfStated(value, stated) !== null;
