/**
 * File names for downloads: ASCII letters, digits, dots, dashes and underscores only (a title can
 * hold anything, including quotes, slashes and line breaks), with an RFC 6266 `filename*` for
 * the readable UTF-8 form.
 */
export function safeBaseName(title: string, fallback = 'spectrum'): string {
  const ascii = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/^[-.]+|[-.]+$/g, '')
    .replace(/-{2,}/g, '-')
    .slice(0, 80)
    .replace(/[-.]+$/, '');
  return ascii || fallback;
}

export function exportFilename(title: string, revision: number, suffix: string, ext: string): string {
  return `${safeBaseName(title)}-r${revision}${suffix ? `-${suffix}` : ''}.${ext}`;
}

/** `attachment` (a download) or `inline` (shown, e.g. the printable record), with both name forms. */
export function contentDisposition(filename: string, mode: 'attachment' | 'inline' = 'attachment'): string {
  const ascii = filename.replace(/[^A-Za-z0-9._-]/g, '_');
  const utf8 = encodeURIComponent(filename).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${mode}; filename="${ascii}"; filename*=UTF-8''${utf8}`;
}
