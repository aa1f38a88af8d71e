import { connect } from 'node:net';

/** What the server answered to a body streamed with no declared length, and how much of it went out. */
export interface StreamedAnswer {
  status: number;
  /** Header names in lower case. */
  headers: Record<string, string>;
  /** The answer's bytes after the headers, as text (chunk framing left in place). */
  body: string;
  /** Body bytes handed to the socket before the server answered or closed. */
  sentBytes: number;
}

export interface StreamedRequest {
  method?: string;
  headers?: Record<string, string>;
  /** Bytes sent first (a multipart head, the start of a JSON document). */
  head?: Buffer;
  /** The filler repeated after the head. */
  chunk: Buffer;
  /** At most this many fillers; the request ends normally after them. */
  maxChunks: number;
}

/**
 * Sends a chunked request body over a plain socket, one filler at a time, and stops writing as soon as
 * any answer arrives. A server that refuses a body part-way answers and closes while the client is still
 * writing; a fetch client then often fails with EPIPE before it reads the answer, so a test of that
 * refusal reads the socket itself. After each write it lets the event loop read first, so an answer that
 * has arrived is never lost behind a failing write.
 */
export function sendStreamedBody(baseUrl: string, path: string, request: StreamedRequest): Promise<StreamedAnswer> {
  const url = new URL(path, baseUrl);
  const headerLines = Object.entries({
    host: url.host,
    origin: url.origin,
    'transfer-encoding': 'chunked',
    connection: 'close',
    ...request.headers,
  }).map(([name, value]) => `${name}: ${value}`);
  const start = `${request.method ?? 'POST'} ${url.pathname}${url.search} HTTP/1.1\r\n${headerLines.join('\r\n')}\r\n\r\n`;

  return new Promise((resolve, reject) => {
    const socket = connect(Number(url.port), url.hostname);
    const received: Buffer[] = [];
    let failure: Error | undefined;
    let sentBytes = 0;
    let stopped = false;

    socket.on('data', (data: Buffer) => {
      received.push(data);
      stopped = true;
    });
    socket.on('error', (error) => {
      failure = error;
      stopped = true;
    });
    socket.on('close', () => {
      const text = Buffer.concat(received).toString('latin1');
      const split = text.indexOf('\r\n\r\n');
      const statusMatch = /^HTTP\/1\.[01] (\d{3})/.exec(text);
      if (!statusMatch || split < 0) {
        reject(new Error(`no answer after ${sentBytes} bytes${failure ? `: ${failure.message}` : ''}`));
        return;
      }
      const headers: Record<string, string> = {};
      for (const line of text.slice(0, split).split('\r\n').slice(1)) {
        const colon = line.indexOf(':');
        if (colon > 0) headers[line.slice(0, colon).trim().toLowerCase()] = line.slice(colon + 1).trim();
      }
      resolve({ status: Number(statusMatch[1]), headers, body: text.slice(split + 4), sentBytes });
    });

    const frame = (bytes: Buffer) =>
      Buffer.concat([Buffer.from(`${bytes.length.toString(16)}\r\n`), bytes, Buffer.from('\r\n')]);
    const write = (bytes: Buffer) =>
      new Promise<void>((done) => {
        socket.write(bytes, () => done());
      });
    const yieldToReads = () => new Promise<void>((done) => setTimeout(done, 1));

    socket.once('connect', () => {
      void (async () => {
        await write(Buffer.from(start, 'latin1'));
        if (request.head && !stopped) {
          await write(frame(request.head));
          sentBytes += request.head.length;
        }
        for (let i = 0; i < request.maxChunks && !stopped; i += 1) {
          await write(frame(request.chunk));
          await yieldToReads();
          if (!failure) sentBytes += request.chunk.length;
        }
        if (!stopped) await write(Buffer.from('0\r\n\r\n'));
        // Half-close: the server still answers on its side.
        if (!socket.destroyed) socket.end();
      })();
    });
  });
}
