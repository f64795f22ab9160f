/** Escaping for text placed in HTML element content and attribute values. */
export function esc(value: unknown): string {
  const s = value === null || value === undefined ? '' : String(value);
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Text with its line breaks kept (escaped first). */
export function escLines(value: string): string {
  return esc(value).replace(/\r?\n/g, '<br>');
}
