// The local fake mail server for development and tests. It accepts any mail over SMTP on
// 127.0.0.1:$SMTP_PORT, keeps it in memory, and shows it on http://127.0.0.1:$MAIL_UI_PORT:
// a page to read the caught mail, and a JSON API for tests:
//   GET /api/messages[?to=address]   newest first
//   GET /api/messages/:id            one mail
//   DELETE /api/messages             forget everything
import http from 'node:http';
import { SMTPServer } from 'smtp-server';
import { parseMessage } from './mail/parse-message';

const SMTP_PORT = Number(process.env.SMTP_PORT ?? 2525);
const UI_PORT = Number(process.env.MAIL_UI_PORT ?? 2580);
const KEEP = 1000;

type Caught = ReturnType<typeof parseMessage> & {
  id: number;
  receivedAt: string;
  envelope: { from: string; to: string[] };
  kind: string | null;
};

let messages: Caught[] = [];
let nextId = 1;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  logger: false,
  size: 10 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (c: Buffer) => chunks.push(c));
    stream.on('end', () => {
      try {
        const parsed = parseMessage(Buffer.concat(chunks).toString('utf8'));
        const from = session.envelope.mailFrom;
        messages.unshift({
          ...parsed,
          id: nextId++,
          receivedAt: new Date().toISOString(),
          envelope: {
            from: from ? from.address : '',
            to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          },
          kind: parsed.headers['x-outturn-kind'] ?? null,
        });
        messages = messages.slice(0, KEEP);
        callback();
      } catch (error) {
        callback(error as Error);
      }
    });
  },
});
smtp.on('error', (error) => console.error('SMTP:', error.message));

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function page(title: string, body: string) {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escape(title)}</title>
<style>
body{margin:0;font:14px/1.45 system-ui,sans-serif;background:#f7f5ef;color:#1f2328}
header{padding:10px 20px;border-bottom:1px solid #d8d2c4;background:#fffdf8;display:flex;gap:16px;align-items:center}
main{padding:16px 20px;max-width:1100px}
table{border-collapse:collapse;width:100%;background:#fffdf8;border:1px solid #d8d2c4}
th,td{text-align:left;padding:5px 10px;border-bottom:1px solid #ebe6da;vertical-align:top}
th{font-size:12px;text-transform:uppercase;letter-spacing:.04em;color:#57606a}
a{color:#1f5f8b} .muted{color:#57606a} pre{white-space:pre-wrap;background:#fffdf8;border:1px solid #d8d2c4;padding:12px}
iframe{width:100%;height:560px;border:1px solid #d8d2c4;background:#fff}
button{font:inherit;padding:3px 10px}
</style></head><body><header><strong>Outturn · caught mail</strong>
<span class="muted">SMTP 127.0.0.1:${SMTP_PORT} — nothing here leaves this machine</span></header><main>${body}</main></body></html>`;
}

function listPage() {
  if (!messages.length)
    return page(
      'Caught mail',
      '<p>No mail yet. Invite someone or ask for a password reset, then reload.</p>',
    );
  const rows = messages
    .map(
      (m) =>
        `<tr><td class="muted">${escape(new Date(m.receivedAt).toLocaleString('en-GB'))}</td>` +
        `<td>${escape(m.envelope.to.join(', '))}</td><td class="muted">${escape(m.kind ?? '')}</td>` +
        `<td><a href="/messages/${m.id}">${escape(m.subject || '(no subject)')}</a></td></tr>`,
    )
    .join('');
  return page(
    'Caught mail',
    `<form method="post" action="/clear" style="margin-bottom:10px"><button>Forget all ${messages.length}</button></form>
<table><thead><tr><th>Received</th><th>To</th><th>Kind</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>`,
  );
}

function messagePage(m: Caught) {
  return page(
    m.subject,
    `<p><a href="/">← All mail</a></p><h1 style="font-size:18px">${escape(m.subject)}</h1>
<p class="muted">From ${escape(m.from)} · to ${escape(m.envelope.to.join(', '))} · ${escape(m.receivedAt)}</p>
<h2 style="font-size:14px">HTML</h2><iframe sandbox title="HTML body" src="/messages/${m.id}/html"></iframe>
<h2 style="font-size:14px">Text</h2><pre>${escape(m.text)}</pre>`,
  );
}

function send(res: http.ServerResponse, status: number, type: string, body: string) {
  res.writeHead(status, { 'content-type': `${type}; charset=utf-8`, 'cache-control': 'no-store' });
  res.end(body);
}

const ui = http.createServer((req, res) => {
  const url = new URL(req.url ?? '/', `http://127.0.0.1:${UI_PORT}`);
  const path = url.pathname;
  const byId = (id: string) => messages.find((m) => m.id === Number(id));
  let match: RegExpMatchArray | null;
  if (req.method === 'GET' && path === '/api/messages') {
    const to = url.searchParams.get('to')?.toLowerCase();
    const list = to ? messages.filter((m) => m.envelope.to.includes(to) || m.to.includes(to)) : messages;
    return send(res, 200, 'application/json', JSON.stringify({ messages: list }));
  }
  if (req.method === 'DELETE' && path === '/api/messages') {
    messages = [];
    return send(res, 200, 'application/json', JSON.stringify({ messages: [] }));
  }
  if (req.method === 'GET' && (match = path.match(/^\/api\/messages\/(\d+)$/))) {
    const m = byId(match[1]);
    return m
      ? send(res, 200, 'application/json', JSON.stringify(m))
      : send(res, 404, 'application/json', JSON.stringify({ error: 'No such message' }));
  }
  if (req.method === 'GET' && path === '/') return send(res, 200, 'text/html', listPage());
  if (req.method === 'POST' && path === '/clear') {
    messages = [];
    res.writeHead(303, { location: '/' });
    return res.end();
  }
  if (req.method === 'GET' && (match = path.match(/^\/messages\/(\d+)(\/html)?$/))) {
    const m = byId(match[1]);
    if (!m)
      return send(
        res,
        404,
        'text/html',
        page('Not found', '<p>No such message. <a href="/">All mail</a></p>'),
      );
    if (match[2]) {
      // Shown in a sandboxed frame, with scripts refused as well.
      res.setHeader('content-security-policy', "script-src 'none'");
      return send(res, 200, 'text/html', m.html || `<pre>${escape(m.text)}</pre>`);
    }
    return send(res, 200, 'text/html', messagePage(m));
  }
  send(res, 404, 'application/json', JSON.stringify({ error: 'Not found' }));
});

// SMTP first: services.sh waits for the UI port, so once that answers both are ready.
smtp.listen(SMTP_PORT, '127.0.0.1', () => {
  ui.listen(UI_PORT, '127.0.0.1', () =>
    console.log(`Mail fake: SMTP on 127.0.0.1:${SMTP_PORT}, mail viewer on http://127.0.0.1:${UI_PORT}`),
  );
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    ui.close();
    smtp.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 1000).unref();
  });
}
