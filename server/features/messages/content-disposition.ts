/**
 * The Content-Disposition of a downloaded attachment. The name is the uploader's, so it is cleaned: no
 * quotes, backslashes, slashes or control characters (they could break out of the header or suggest a
 * path). An ASCII `filename` for old clients plus the RFC 6266 / RFC 8187 `filename*` UTF-8 form.
 */
export function contentDisposition(name: string): string {
  // eslint-disable-next-line no-control-regex
  const clean = name.replace(/[\u0000-\u001f\u007f"\\/]/g, '_').slice(0, 200) || 'attachment';
  const ascii = clean.replace(/[^\x20-\x7e]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeRfc8187(clean)}`;
}

// encodeURIComponent leaves ' ( ) * ! unescaped; RFC 8187's attr-char does not allow ' ( ) *.
function encodeRfc8187(value: string): string {
  return encodeURIComponent(value).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}
