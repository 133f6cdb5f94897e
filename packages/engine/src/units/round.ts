/** Round for display in messages only (never for money, never before further arithmetic). */
export function roundForDisplay(x: number, decimals = 2): number {
  const f = 10 ** decimals;
  return Math.round(x * f) / f;
}
