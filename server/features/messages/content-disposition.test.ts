import { describe, expect, it } from 'vitest';
import { contentDisposition } from './content-disposition';

describe('contentDisposition', () => {
  it('always says attachment, so the browser downloads instead of rendering', () => {
    expect(contentDisposition('chart.pdf')).toBe(`attachment; filename="chart.pdf"; filename*=UTF-8''chart.pdf`);
  });

  it('cannot be broken out of with quotes, line breaks or path separators', () => {
    const header = contentDisposition('a"b\r\nSet-Cookie: x=1/../c\\d.txt');
    expect(header).not.toMatch(/[\r\n]/);
    expect(header.split('"')).toHaveLength(3);
    expect(header).toContain('filename="a_b__Set-Cookie: x=1_.._c_d.txt"');
  });

  it('keeps a non-ASCII name in the UTF-8 form and replaces it in the ASCII one (RFC 8187 attr-chars)', () => {
    const header = contentDisposition("Übung (take 2)'s.wav");
    expect(header).toContain('filename="_bung (take 2)\'s.wav"');
    expect(header).toContain("filename*=UTF-8''%C3%9Cbung%20%28take%202%29%27s.wav");
  });

  it('names an empty name "attachment"', () => {
    expect(contentDisposition('')).toContain('filename="attachment"');
  });
});
