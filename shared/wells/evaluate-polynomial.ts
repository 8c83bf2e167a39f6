/**
 * Horner evaluation of a0 + a1·z + a2·z² + … . The fitted well-function pieces are kept as
 * plain coefficient arrays so that the fitting script alone decides their degree.
 * @param coeffs power-series coefficients, lowest order first
 * @param z the (mapped, dimensionless) variable
 */
export function evaluatePolynomial(coeffs: readonly number[], z: number): number {
  let acc = 0;
  for (let i = coeffs.length - 1; i >= 0; i--) acc = acc * z + coeffs[i]!;
  return acc;
}
