import { describe, expect, it } from 'vitest';
import { decodeHtmlEntities, extractLinks, linksFromHtml, linksFromText, segmentText } from './links';

describe('mail links', () => {
  it('decodes named and numeric entities in hrefs', () => {
    expect(decodeHtmlEntities('a&amp;b&#38;c&#x26;d&lt;&unknown;')).toBe('a&b&c&d<&unknown;');
  });

  it('reads double-, single- and un-quoted hrefs and skips fragments and javascript:', () => {
    const html = `<a class="x" href="https://a.test/1">1</a><A HREF='http://b.test/2'>2</A><a href=https://c.test/3>3</a>
      <a href="#top">top</a><a href="javascript:alert(1)">x</a><a href="mailto:help@kitlane.test">mail</a>`;
    expect(linksFromHtml(html)).toEqual(['https://a.test/1', 'http://b.test/2', 'https://c.test/3', 'mailto:help@kitlane.test']);
  });

  it('leaves sentence punctuation and brackets outside URLs in text', () => {
    expect(linksFromText('Go to https://a.test/x?y=1. Or (http://b.test/z), or https://')).toEqual(['https://a.test/x?y=1', 'http://b.test/z']);
  });

  it('lists each link once, HTML part first', () => {
    expect(extractLinks('<a href="https://a.test/2">2</a>', 'https://a.test/1 and https://a.test/2')).toEqual(['https://a.test/2', 'https://a.test/1']);
    expect(extractLinks(null, null)).toEqual([]);
  });

  it('cuts text into text and URL segments that join back to the original', () => {
    const text = 'Open https://a.test/p. Then <stop>.';
    const segments = segmentText(text);
    expect(segments).toEqual([
      { kind: 'text', value: 'Open ' },
      { kind: 'url', value: 'https://a.test/p' },
      { kind: 'text', value: '. Then <stop>.' },
    ]);
    expect(segments.map((s) => s.value).join('')).toBe(text);
  });
});
