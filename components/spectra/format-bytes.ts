/** Sizes in binary units, as the 64 MiB limit is written. */
export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  // One decimal where it says something: 64 MiB, not 64.0 MiB.
  if (n < 1024 * 1024) return `${Number((n / 1024).toFixed(1))} KiB`;
  return `${Number((n / 1024 / 1024).toFixed(1))} MiB`;
}
