// Conversions of stated limits into standard uncertainties, after the GUM
// (JCGM 100:2008, "Evaluation of measurement data — Guide to the expression
// of uncertainty in measurement"). Every "±a" an input states goes through here,
// so no caller treats a tolerance as if it were already one standard uncertainty.

/**
 * Standard uncertainty of a quantity known only to lie within ±halfWidth of its
 * stated value, every value in between equally likely (a rectangular
 * distribution): u = a/√3 (GUM §4.3.7).
 */
export function rectangularStdUncertainty(halfWidth: number): number {
  if (!(halfWidth >= 0)) throw new RangeError(`a tolerance half-width must be 0 or more, got ${halfWidth}`);
  return halfWidth / Math.sqrt(3);
}
