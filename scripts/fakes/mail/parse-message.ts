// A small MIME reader for the local fake SMTP server: enough to show what nodemailer sends
// (headers with encoded words, multipart/alternative or mixed, quoted-printable or base64
// parts). It is for reading test mail, not for arbitrary mail from the internet.

export type ParsedMessage = {
  headers: Record<string, string>;
  subject: string;
  from: string;
  to: string[];
  text: string;
  html: string;
};

type Part = { headers: Record<string, string>; body: string };

/** Decodes RFC 2047 encoded words such as =?UTF-8?Q?Caf=C3=A9?= in a header value. */
export function decodeWords(value: string): string {
  return value
    .replace(/(=\?[^?]+\?[QqBb]\?[^?]*\?=)\s+(?==\?)/g, '$1')
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_all, charset: string, encoding: string, data: string) => {
      const bytes =
        encoding.toUpperCase() === 'B' ? Buffer.from(data, 'base64') : qpBytes(data.replace(/_/g, ' '));
      return decodeBytes(bytes, charset);
    });
}

function decodeBytes(bytes: Buffer, charset = 'utf-8'): string {
  try {
    return new TextDecoder(charset.toLowerCase()).decode(bytes);
  } catch {
    return bytes.toString('utf8');
  }
}

function qpBytes(text: string): Buffer {
  const out: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(text.slice(i + 1, i + 3))) {
      out.push(parseInt(text.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      out.push(...Buffer.from(c, 'utf8'));
    }
  }
  return Buffer.from(out);
}

/** Quoted-printable body: soft line breaks ("=" at the end of a line) join lines. */
export function decodeQuotedPrintable(body: string): Buffer {
  return qpBytes(body.replace(/=\r?\n/g, ''));
}

function splitHeaders(raw: string): Part {
  const match = /\r?\n\r?\n/.exec(raw);
  const head = match ? raw.slice(0, match.index) : raw;
  const body = match ? raw.slice(match.index + match[0].length) : '';
  const headers: Record<string, string> = {};
  // Unfold continuation lines, then read "Name: value".
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    const value = line.slice(colon + 1).trim();
    headers[name] = headers[name] ? `${headers[name]}, ${value}` : value;
  }
  return { headers, body };
}

function param(header: string | undefined, name: string): string | undefined {
  const match = new RegExp(`;\\s*${name}\\s*=\\s*("([^"]*)"|[^;\\s]+)`, 'i').exec(header ?? '');
  return match ? (match[2] ?? match[1]) : undefined;
}

function decodeBody(part: Part): string {
  const encoding = (part.headers['content-transfer-encoding'] ?? '7bit').toLowerCase();
  const charset = param(part.headers['content-type'], 'charset') ?? 'utf-8';
  if (encoding === 'base64')
    return decodeBytes(Buffer.from(part.body.replace(/\s+/g, ''), 'base64'), charset);
  if (encoding === 'quoted-printable') return decodeBytes(decodeQuotedPrintable(part.body), charset);
  return part.body;
}

function collect(part: Part, into: { text: string; html: string }) {
  const type = (part.headers['content-type'] ?? 'text/plain').toLowerCase();
  if (type.startsWith('multipart/')) {
    const boundary = param(part.headers['content-type'], 'boundary');
    if (!boundary) return;
    const pieces = part.body.split(
      new RegExp(`\\r?\\n?--${boundary.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`),
    );
    // pieces[0] is the preamble; the last piece starts with "--" (the closing delimiter).
    for (const piece of pieces.slice(1)) {
      if (piece.startsWith('--')) break;
      collect(splitHeaders(piece.replace(/^[ \t]*\r?\n/, '')), into);
    }
    return;
  }
  if (/attachment/i.test(part.headers['content-disposition'] ?? '')) return;
  if (type.startsWith('text/html') && !into.html) into.html = decodeBody(part).replace(/\r\n/g, '\n');
  else if (type.startsWith('text/plain') && !into.text) into.text = decodeBody(part).replace(/\r\n/g, '\n');
}

function addresses(value: string | undefined): string[] {
  if (!value) return [];
  return decodeWords(value)
    .split(',')
    .map((a) => (/<([^>]+)>/.exec(a)?.[1] ?? a).trim().toLowerCase())
    .filter(Boolean);
}

export function parseMessage(raw: string): ParsedMessage {
  const top = splitHeaders(raw);
  const bodies = { text: '', html: '' };
  collect(top, bodies);
  const headers: Record<string, string> = {};
  for (const [name, value] of Object.entries(top.headers)) headers[name] = decodeWords(value);
  return {
    headers,
    subject: headers.subject ?? '',
    from: headers.from ?? '',
    to: addresses(top.headers.to),
    text: bodies.text.replace(/\n+$/, ''),
    html: bodies.html,
  };
}
