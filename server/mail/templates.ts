import type { OutgoingMail } from './outbox';

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export type MailLink = { label: string; url: string };

/** One layout for every mail: a greeting, paragraphs, one button-like link, a footer. */
export function composeMail(opts: {
  to: string;
  subject: string;
  greeting: string;
  paragraphs: string[];
  link?: MailLink;
  footer?: string;
}): OutgoingMail {
  const footer = opts.footer ?? 'You get this mail because you have a Kitlane account.';
  const text = [
    opts.greeting,
    '',
    ...opts.paragraphs.flatMap((p) => [p, '']),
    ...(opts.link ? [`${opts.link.label}: ${opts.link.url}`, ''] : []),
    '—',
    footer,
  ].join('\n');
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#1f2933;max-width:560px">
<p>${esc(opts.greeting)}</p>
${opts.paragraphs.map((p) => `<p>${esc(p)}</p>`).join('\n')}
${opts.link ? `<p><a href="${esc(opts.link.url)}" style="background:#0f766e;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${esc(opts.link.label)}</a></p><p style="font-size:12px;color:#52606d">${esc(opts.link.url)}</p>` : ''}
<hr><p style="font-size:12px;color:#52606d">${esc(footer)}</p></body></html>`;
  return { to: opts.to, subject: opts.subject, text, html };
}
