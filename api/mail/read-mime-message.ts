/**
 * A small MIME reader for the local sink: headers (unfolded, RFC 2047 encoded
 * words), multipart bodies, base64 / quoted-printable transfer encodings. It
 * reads what nodemailer writes; it is not a general mail parser.
 */

export interface ReadMessage {
  subject: string;
  text: string | null;
  html: string | null;
}

interface Part {
  headers: Map<string, string>;
  body: string;
}

function splitPart(raw: string): Part {
  const end = raw.search(/\r?\n\r?\n/);
  const head = end < 0 ? raw : raw.slice(0, end);
  const body = end < 0 ? '' : raw.slice(end).replace(/^\r?\n\r?\n/, '');
  const headers = new Map<string, string>();
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function headerParam(value: string, name: string): string | undefined {
  const match = new RegExp(`${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i').exec(value);
  return match ? (match[1] ?? match[2]) : undefined;
}

function decodeQuotedPrintable(text: string): Buffer {
  const joined = text.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(joined[i], 'utf8'));
    }
  }
  return Buffer.from(bytes);
}

/** The decoded text with SMTP's CRLF line ends turned back into LF. */
function decodeBody(part: Part): string {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  let text: string;
  if (encoding === 'base64') text = Buffer.from(part.body.replace(/\s+/g, ''), 'base64').toString('utf8');
  else if (encoding === 'quoted-printable') text = decodeQuotedPrintable(part.body).toString('utf8');
  else text = part.body.replace(/\r?\n$/, '');
  return text.replace(/\r\n/g, '\n');
}

/** "=?UTF-8?Q?...?=" and "=?UTF-8?B?...?=" words (RFC 2047); whitespace between words is dropped. */
export function decodeEncodedWords(value: string): string {
  return value
    .replace(/(\?=)\s+(=\?)/g, '$1$2')
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_m, _charset: string, kind: string, data: string) =>
      kind.toUpperCase() === 'B'
        ? Buffer.from(data, 'base64').toString('utf8')
        : decodeQuotedPrintable(data.replace(/_/g, ' ')).toString('utf8'),
    );
}

function collect(part: Part, found: { text: string | null; html: string | null }): void {
  const type = part.headers.get('content-type') ?? 'text/plain';
  const mediaType = type.split(';')[0].trim().toLowerCase();
  if (mediaType.startsWith('multipart/')) {
    const boundary = headerParam(type, 'boundary');
    if (!boundary) return;
    const sections = part.body.split(`--${boundary}`).slice(1);
    for (const section of sections) {
      if (section.startsWith('--')) break; // closing delimiter
      // The line break before each delimiter belongs to the delimiter (RFC 2046 §5.1.1), not to the part.
      collect(splitPart(section.replace(/^\r?\n/, '').replace(/\r?\n$/, '')), found);
    }
  } else if (mediaType === 'text/plain' && found.text === null) {
    found.text = decodeBody(part);
  } else if (mediaType === 'text/html' && found.html === null) {
    found.html = decodeBody(part);
  }
}

export function readMimeMessage(raw: string): ReadMessage {
  const top = splitPart(raw);
  const found = { text: null as string | null, html: null as string | null };
  collect(top, found);
  return { subject: decodeEncodedWords(top.headers.get('subject') ?? ''), ...found };
}
