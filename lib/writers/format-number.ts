/** Shortest text that reads back to the same double (or `digits` significant digits). */
export function formatNumber(v: number, digits?: number): string {
  if (!Number.isFinite(v)) throw new Error(`cannot write the non-finite value ${v}`);
  if (v === 0) return '0';
  return digits === undefined ? String(v) : String(Number(v.toPrecision(digits)));
}
