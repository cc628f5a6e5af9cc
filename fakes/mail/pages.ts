// HTML pages of the mail catcher's web view. Every value that came in by mail is escaped: a subject or
// address is attacker-controlled text, and the catcher must not become a way to run script on localhost.
import { segmentText } from './links';
import type { CaughtMail } from './store';

export const CATCHER_LABEL = 'Kitlane local mail catcher — nothing leaves this machine';

const HTML_ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (char) => HTML_ESCAPES[char]);
}

// The catcher's own look: plain system fonts, high-contrast ink on paper, one accent. Colours keep at
// least 4.5:1 contrast for body text (WCAG 2.x AA) so the inbox is readable by everyone.
const STYLES = `
:root { color-scheme: light; --ink: #1c2430; --muted: #4a5568; --line: #d5dbe3; --paper: #fbfcfd; --accent: #0b5f8a; }
* { box-sizing: border-box; }
body { margin: 0; font: 16px/1.5 system-ui, sans-serif; color: var(--ink); background: var(--paper); }
header { background: var(--ink); color: #fff; padding: .75rem 1.25rem; }
header p { margin: 0; font-weight: 600; }
header a { color: #fff; }
main { max-width: 64rem; margin: 0 auto; padding: 1.25rem; }
h1 { font-size: 1.4rem; margin: 0 0 1rem; overflow-wrap: anywhere; }
h2 { font-size: 1.1rem; margin: 1.5rem 0 .5rem; }
a { color: var(--accent); }
a:focus-visible, button:focus-visible { outline: 3px solid #e0a100; outline-offset: 2px; }
table { width: 100%; border-collapse: collapse; }
caption { text-align: left; color: var(--muted); padding-bottom: .5rem; }
th, td { text-align: left; padding: .5rem; border-bottom: 1px solid var(--line); vertical-align: top; overflow-wrap: anywhere; }
th { font-size: .85rem; text-transform: uppercase; letter-spacing: .04em; color: var(--muted); }
dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; margin: 0; }
dt { color: var(--muted); }
dd { margin: 0; overflow-wrap: anywhere; }
pre { white-space: pre-wrap; overflow-wrap: anywhere; background: #fff; border: 1px solid var(--line); padding: 1rem; font-size: .95rem; }
iframe { width: 100%; min-height: 28rem; border: 1px solid var(--line); background: #fff; }
.actions { display: flex; gap: 1rem; align-items: center; margin-bottom: 1rem; }
button { font: inherit; padding: .35rem .9rem; border: 1px solid var(--ink); background: #fff; color: var(--ink); border-radius: 4px; cursor: pointer; }
.empty { color: var(--muted); }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Kitlane mail catcher</title>
<style>${STYLES}</style>
</head>
<body>
<header><p><a href="/">${escapeHtml(CATCHER_LABEL)}</a></p></header>
<main>
${body}
</main>
</body>
</html>`;
}

/** Readable UTC time; the machine-readable value goes in `<time datetime>`. */
function timeElement(iso: string): string {
  const readable = `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`;
  return `<time datetime="${escapeHtml(iso)}">${escapeHtml(readable)}</time>`;
}

function subjectOrPlaceholder(subject: string): string {
  return subject.trim() === '' ? '(no subject)' : subject;
}

function inboxRow(mail: CaughtMail): string {
  return `<tr>
<td>${escapeHtml(mail.to.join(', '))}</td>
<td><a href="/messages/${encodeURIComponent(mail.id)}">${escapeHtml(subjectOrPlaceholder(mail.subject))}</a></td>
<td>${timeElement(mail.date)}</td>
</tr>`;
}

/** `messages` must already be newest first. */
export function renderInbox(messages: CaughtMail[]): string {
  const count = `${messages.length} message${messages.length === 1 ? '' : 's'}`;
  const list =
    messages.length === 0
      ? '<p class="empty">No mail caught yet. Mail sent to this machine\'s SMTP port shows up here.</p>'
      : `<table>
<caption>${count}, newest first</caption>
<thead><tr><th scope="col">To</th><th scope="col">Subject</th><th scope="col">Received</th></tr></thead>
<tbody>
${messages.map(inboxRow).join('\n')}
</tbody>
</table>`;
  return layout(
    'Inbox',
    `<h1>Inbox</h1>
<div class="actions">
<a href="/">Refresh</a>
<form method="post" action="/clear"><button type="submit">Delete all messages</button></form>
</div>
${list}`,
  );
}

function linkifiedText(text: string): string {
  return segmentText(text)
    .map((segment) =>
      segment.kind === 'url'
        ? `<a href="${escapeHtml(segment.value)}" rel="noreferrer">${escapeHtml(segment.value)}</a>`
        : escapeHtml(segment.value),
    )
    .join('');
}

function linkList(links: string[]): string {
  if (links.length === 0) return '<p class="empty">This message has no links.</p>';
  const items = links.map((link) => `<li><a href="${escapeHtml(link)}" rel="noreferrer">${escapeHtml(link)}</a></li>`);
  return `<ul>\n${items.join('\n')}\n</ul>`;
}

function addressRow(label: string, addresses: string[]): string {
  return addresses.length === 0 ? '' : `<dt>${label}</dt><dd>${escapeHtml(addresses.join(', '))}</dd>`;
}

export function renderMessage(mail: CaughtMail): string {
  const htmlPart = mail.html
    ? `<h2>HTML part</h2>
<iframe src="/messages/${encodeURIComponent(mail.id)}/html" title="HTML part of the message"
  sandbox="allow-popups allow-popups-to-escape-sandbox" referrerpolicy="no-referrer"></iframe>`
    : '';
  const textPart = mail.text ? `<h2>Text part</h2>\n<pre>${linkifiedText(mail.text)}</pre>` : '';
  const noBody = !mail.html && !mail.text ? '<p class="empty">This message has no body.</p>' : '';
  return layout(
    subjectOrPlaceholder(mail.subject),
    `<p><a href="/">← Back to the inbox</a></p>
<h1>${escapeHtml(subjectOrPlaceholder(mail.subject))}</h1>
<dl>
<dt>From</dt><dd>${escapeHtml(mail.from)}</dd>
${addressRow('To', mail.to)}
${addressRow('Cc', mail.cc)}
${addressRow('Envelope', mail.envelopeTo)}
<dt>Received</dt><dd>${timeElement(mail.date)}</dd>
</dl>
<h2>Links</h2>
${linkList(mail.links)}
${htmlPart}
${textPart}
${noBody}`,
  );
}

export function renderNotFound(what: string): string {
  return layout('Not found', `<h1>Not found</h1>\n<p>${escapeHtml(what)}</p>\n<p><a href="/">Back to the inbox</a></p>`);
}

/**
 * The message's own HTML for the sandboxed iframe. A `<base target="_blank">` makes its links open in a
 * new tab: a sandboxed frame may open pop-ups (allowed) but may not navigate the catcher's own page.
 */
export function messageHtmlDocument(html: string): string {
  const base = '<base target="_blank">';
  const head = /<head\b[^>]*>/i.exec(html);
  if (head) {
    const at = head.index + head[0].length;
    return html.slice(0, at) + base + html.slice(at);
  }
  return base + html;
}
