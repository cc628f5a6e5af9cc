// Link extraction for caught mail. Tests click "the link in the e-mail" (verify address, reset password,
// open booking), so the catcher hands them out ready to use: entities decoded, duplicates dropped, in the
// order a reader would meet them (HTML part first, then the text part).

const NAMED_ENTITIES: Record<string, string> = {
  amp: '&',
  lt: '<',
  gt: '>',
  quot: '"',
  apos: "'",
  nbsp: '\u00a0',
};

/** Decodes the entities that appear inside href attributes (`&amp;` between query parameters above all). */
export function decodeHtmlEntities(value: string): string {
  return value.replace(/&(#x[0-9a-f]+|#[0-9]+|[a-z]+);/gi, (whole, body: string) => {
    if (body[0] === '#') {
      const codePoint = body[1] === 'x' || body[1] === 'X' ? parseInt(body.slice(2), 16) : parseInt(body.slice(1), 10);
      return Number.isFinite(codePoint) && codePoint > 0 && codePoint <= 0x10ffff ? String.fromCodePoint(codePoint) : whole;
    }
    return NAMED_ENTITIES[body.toLowerCase()] ?? whole;
  });
}

// Only links a person could follow from a mail client; `#top` anchors and `javascript:` are not links.
const FOLLOWABLE = /^(https?:|mailto:)/i;

const HREF_IN_ANCHOR = /<a\b[^>]*?\bhref\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'>]+))/gi;

/** hrefs of `<a>` elements in an HTML body, entity-decoded. */
export function linksFromHtml(html: string): string[] {
  const found: string[] = [];
  for (const match of html.matchAll(HREF_IN_ANCHOR)) {
    const raw = match[1] ?? match[2] ?? match[3] ?? '';
    const href = decodeHtmlEntities(raw).trim();
    if (FOLLOWABLE.test(href)) found.push(href);
  }
  return found;
}

const URL_IN_TEXT = /\bhttps?:\/\/[^\s<>"'`]+/gi;
// A sentence that ends with a URL keeps its full stop outside the link; so do brackets around it.
const TRAILING_PUNCTUATION = /[.,;:!?)\]}>]+$/;

/** http(s) URLs written out in a plain-text body. */
export function linksFromText(text: string): string[] {
  const found: string[] = [];
  for (const match of text.matchAll(URL_IN_TEXT)) {
    const url = match[0].replace(TRAILING_PUNCTUATION, '');
    if (url.length > 'https://'.length) found.push(url);
  }
  return found;
}

/** All followable links of a message, HTML part first, each once. */
export function extractLinks(html: string | null, text: string | null): string[] {
  const all = [...(html ? linksFromHtml(html) : []), ...(text ? linksFromText(text) : [])];
  return [...new Set(all)];
}

/** A plain-text body cut into runs of text and URLs, so a page can escape the one and link the other. */
export type TextSegment = { kind: 'text'; value: string } | { kind: 'url'; value: string };

export function segmentText(text: string): TextSegment[] {
  const segments: TextSegment[] = [];
  let cursor = 0;
  for (const match of text.matchAll(URL_IN_TEXT)) {
    const start = match.index ?? 0;
    const url = match[0].replace(TRAILING_PUNCTUATION, '');
    if (url.length <= 'https://'.length) continue;
    if (start > cursor) segments.push({ kind: 'text', value: text.slice(cursor, start) });
    segments.push({ kind: 'url', value: url });
    cursor = start + url.length;
  }
  if (cursor < text.length) segments.push({ kind: 'text', value: text.slice(cursor) });
  return segments;
}
