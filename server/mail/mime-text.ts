/**
 * Reads what a person needs from a raw RFC 5322 message: the From/To/Subject headers (with RFC 2047
 * encoded words decoded) and the plain-text body (single part or the first text/plain part of a
 * multipart message; 7bit, 8bit, quoted-printable or base64 transfer encodings, RFC 2045). UTF-8 and
 * US-ASCII only — what our own mailer sends. Used by the development mail catcher.
 */

export interface ReadableMessage {
  from: string;
  to: string;
  subject: string;
  text: string;
}

type Headers = Map<string, string>;

function splitHeadersAndBody(raw: string): { headers: Headers; body: string } {
  const normalised = raw.replace(/\r\n/g, '\n');
  const end = normalised.indexOf('\n\n');
  const head = end < 0 ? normalised : normalised.slice(0, end);
  const body = end < 0 ? '' : normalised.slice(end + 2);
  const headers: Headers = new Map();
  for (const line of head.replace(/\n[ \t]+/g, ' ').split('\n')) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function decodeQuotedPrintableBytes(s: string, underscoreIsSpace: boolean): Buffer {
  const bytes: number[] = [];
  const text = s.replace(/=\n/g, '');
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(text.slice(i + 1, i + 3))) {
      bytes.push(parseInt(text.slice(i + 1, i + 3), 16));
      i += 2;
    } else if (c === '_' && underscoreIsSpace) {
      bytes.push(0x20);
    } else {
      bytes.push(...Buffer.from(c, 'utf8'));
    }
  }
  return Buffer.from(bytes);
}

/** RFC 2047 encoded words (=?UTF-8?B?…?= and =?UTF-8?Q?…?=); whitespace between two of them is dropped. */
export function decodeHeaderValue(value: string): string {
  const word = /=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g;
  return value.replace(/\?=\s+=\?/g, '?==?').replace(word, (_m, _charset: string, enc: string, text: string) =>
    enc.toUpperCase() === 'B'
      ? Buffer.from(text, 'base64').toString('utf8')
      : decodeQuotedPrintableBytes(text, true).toString('utf8'),
  );
}

function parameter(headerValue: string, name: string): string | null {
  const m = new RegExp(`;\\s*${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i').exec(headerValue);
  return m ? (m[1] ?? m[2]) : null;
}

function decodeBody(body: string, transferEncoding: string): string {
  const enc = transferEncoding.toLowerCase();
  if (enc === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (enc === 'quoted-printable') return decodeQuotedPrintableBytes(body, false).toString('utf8');
  return body;
}

function textOf(headers: Headers, body: string): string | null {
  const type = headers.get('content-type') ?? 'text/plain';
  const mediaType = type.split(';')[0].trim().toLowerCase();
  if (mediaType.startsWith('multipart/')) {
    const boundary = parameter(type, 'boundary');
    if (!boundary) return null;
    const parts = body.split(`--${boundary}`).slice(1);
    for (const part of parts) {
      if (part.startsWith('--')) break;
      const inner = splitHeadersAndBody(part.replace(/^\n/, ''));
      const text = textOf(inner.headers, inner.body);
      if (text !== null) return text;
    }
    return null;
  }
  if (mediaType !== 'text/plain') return null;
  return decodeBody(body, headers.get('content-transfer-encoding') ?? '7bit').replace(/\n$/, '');
}

export function readMessage(raw: string): ReadableMessage {
  const { headers, body } = splitHeadersAndBody(raw);
  return {
    from: decodeHeaderValue(headers.get('from') ?? ''),
    to: decodeHeaderValue(headers.get('to') ?? ''),
    subject: decodeHeaderValue(headers.get('subject') ?? ''),
    text: textOf(headers, body) ?? '',
  };
}
