/**
 * CSV export helpers shared by the chain's tables (RFC 4180 quoting;
 * numbers unrounded).
 *
 * @module
 */

/** Quote a CSV field when needed. */
export function _csvField(v: unknown): string {
  const s = typeof v === "number" ? (Number.isFinite(v) ? String(v) : "") : String(v ?? "");
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Rows to CSV text with a header line. */
export function _csv(header: readonly string[], rows: readonly (readonly unknown[])[]): string {
  return [header, ...rows].map((r) => r.map(_csvField).join(",")).join("\n") + "\n";
}
