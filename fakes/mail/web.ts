// The catcher's web side: an HTML inbox for people and a JSON API for tests. Plain node:http keeps the
// fake free of the app's own stack, so a broken app build never takes the mail view down with it.
import type { IncomingMessage, ServerResponse } from 'node:http';
import { messageHtmlDocument, renderInbox, renderMessage, renderNotFound } from './pages';
import type { MailStore } from './store';

// Pages may use their inline stylesheet and frame the message HTML from this origin, nothing else.
const PAGE_CSP =
  "default-src 'none'; style-src 'unsafe-inline'; img-src 'self' data:; frame-src 'self'; form-action 'self'; base-uri 'none'; frame-ancestors 'none'";

// The message's own HTML: no scripts (sandbox without allow-scripts, also when opened directly), and no
// remote images or fonts, so opening a mail never calls out to the network (tracking pixels included).
const MESSAGE_HTML_CSP =
  "sandbox allow-popups allow-popups-to-escape-sandbox; default-src 'none'; img-src data: cid:; style-src 'unsafe-inline'; font-src data:; frame-ancestors 'self'";

function commonHeaders(res: ServerResponse): void {
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Referrer-Policy', 'no-referrer');
  res.setHeader('Cache-Control', 'no-store');
}

function sendHtml(res: ServerResponse, status: number, html: string, csp = PAGE_CSP): void {
  commonHeaders(res);
  res.statusCode = status;
  res.setHeader('Content-Type', 'text/html; charset=utf-8');
  res.setHeader('Content-Security-Policy', csp);
  res.end(html);
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  commonHeaders(res);
  res.statusCode = status;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.end(JSON.stringify(body));
}

function sendJsonError(res: ServerResponse, status: number, code: string, message: string): void {
  sendJson(res, status, { error: { code, message } });
}

function methodNotAllowed(res: ServerResponse, allowed: string[], api: boolean): void {
  res.setHeader('Allow', allowed.join(', '));
  if (api) sendJsonError(res, 405, 'method_not_allowed', `Use ${allowed.join(' or ')} here.`);
  else sendHtml(res, 405, renderNotFound(`This page only answers ${allowed.join(' or ')}.`));
}

/**
 * The "Delete all" form is a state change reachable from any web page by a cross-site POST; refuse it
 * unless the browser says it came from the catcher itself (or sends no Origin, as non-browser clients do).
 */
function isSameOrigin(req: IncomingMessage): boolean {
  const origin = req.headers.origin;
  return origin === undefined || origin === `http://${req.headers.host}`;
}

type Route = { method: string; pattern: RegExp; handle: (req: IncomingMessage, res: ServerResponse, params: string[], url: URL) => void };

export function createWebHandler(store: MailStore): (req: IncomingMessage, res: ServerResponse) => void {
  const routes: Route[] = [
    { method: 'GET', pattern: /^\/$/, handle: (_req, res) => sendHtml(res, 200, renderInbox(store.list())) },
    {
      method: 'GET',
      pattern: /^\/messages\/([^/]+)$/,
      handle: (_req, res, [id]) => {
        const mail = store.get(id);
        if (mail) sendHtml(res, 200, renderMessage(mail));
        else sendHtml(res, 404, renderNotFound(`There is no message ${id}.`));
      },
    },
    {
      method: 'GET',
      pattern: /^\/messages\/([^/]+)\/html$/,
      handle: (_req, res, [id]) => {
        const mail = store.get(id);
        if (!mail) sendHtml(res, 404, renderNotFound(`There is no message ${id}.`));
        else if (!mail.html) sendHtml(res, 404, renderNotFound('This message has no HTML part.'));
        else sendHtml(res, 200, messageHtmlDocument(mail.html), MESSAGE_HTML_CSP);
      },
    },
    {
      method: 'POST',
      pattern: /^\/clear$/,
      handle: (req, res) => {
        if (!isSameOrigin(req)) {
          sendHtml(res, 403, renderNotFound('Messages can only be deleted from the catcher\'s own page.'));
          return;
        }
        store.clear();
        res.statusCode = 303;
        res.setHeader('Location', '/');
        res.end();
      },
    },
    {
      method: 'GET',
      pattern: /^\/api\/messages$/,
      handle: (_req, res, _params, url) => {
        const to = url.searchParams.get('to');
        sendJson(res, 200, store.list(to ? { to } : {}));
      },
    },
    {
      method: 'DELETE',
      pattern: /^\/api\/messages$/,
      handle: (_req, res) => sendJson(res, 200, { deleted: store.clear() }),
    },
    {
      method: 'GET',
      pattern: /^\/api\/messages\/([^/]+)$/,
      handle: (_req, res, [id]) => {
        const mail = store.get(id);
        if (mail) sendJson(res, 200, mail);
        else sendJsonError(res, 404, 'not_found', `There is no message ${id}.`);
      },
    },
    {
      method: 'DELETE',
      pattern: /^\/api\/messages\/([^/]+)$/,
      handle: (_req, res, [id]) => {
        if (store.remove(id)) sendJson(res, 200, { deleted: 1 });
        else sendJsonError(res, 404, 'not_found', `There is no message ${id}.`);
      },
    },
  ];

  return (req, res) => {
    const url = new URL(req.url ?? '/', 'http://catcher.invalid');
    const isApi = url.pathname.startsWith('/api/');
    const matching = routes
      .map((route) => ({ route, match: route.pattern.exec(url.pathname) }))
      .filter((candidate) => candidate.match !== null);
    if (matching.length === 0) {
      if (isApi) sendJsonError(res, 404, 'not_found', `No such endpoint: ${url.pathname}`);
      else sendHtml(res, 404, renderNotFound(`No page at ${url.pathname}.`));
      return;
    }
    // HEAD is answered like GET; node:http drops the body by itself.
    const method = req.method === 'HEAD' ? 'GET' : (req.method ?? 'GET');
    const hit = matching.find((candidate) => candidate.route.method === method);
    if (!hit || !hit.match) {
      methodNotAllowed(res, [...new Set(matching.map((candidate) => candidate.route.method))], isApi);
      return;
    }
    const params = hit.match.slice(1).map((part) => safeDecode(part));
    hit.route.handle(req, res, params, url);
  };
}

function safeDecode(part: string): string {
  try {
    return decodeURIComponent(part);
  } catch {
    return part;
  }
}
