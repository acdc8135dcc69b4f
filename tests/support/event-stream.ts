// A Server-Sent Events reader over a raw http.get, parsing text/event-stream as WHATWG HTML
// "Server-sent events" says (lines end in CRLF, LF or CR; a blank line dispatches; `:` starts a
// comment; one space after the colon is dropped), so that tests and benchmarks see the stream byte
// for byte as a browser's EventSource would read it.
import { type IncomingHttpHeaders, get } from 'node:http';

export interface StreamEvent {
  type: string;
  /** The last event id after this event, as EventSource keeps it. */
  id: string;
  data: string;
  /** performance.now() when the event's blank line arrived. */
  receivedAt: number;
}

export interface EventStream {
  status: number;
  headers: IncomingHttpHeaders;
  /** The answer's body when it is not a stream (an error's JSON). */
  body(): Promise<string>;
  /** Every event so far, in order. */
  readonly events: StreamEvent[];
  readonly comments: string[];
  readonly retry: number | null;
  /** The next event not yet taken; rejects when the stream ends first. */
  next(): Promise<StreamEvent>;
  /** Resolves when the server ends the stream. */
  readonly ended: Promise<void>;
  close(): void;
}

export function openEventStream(
  url: string,
  headers: Record<string, string> = {},
): Promise<EventStream> {
  return new Promise((resolve, reject) => {
    const request = get(
      url,
      { headers: { accept: 'text/event-stream', ...headers }, agent: false },
      (res) => {
        res.setEncoding('utf8');
        const events: StreamEvent[] = [];
        const comments: string[] = [];
        let retry: number | null = null;
        let taken = 0;
        let waiting: {
          resolve: (event: StreamEvent) => void;
          reject: (error: Error) => void;
        } | null = null;
        let finished = false;
        let text = '';
        let pending = '';
        let lastId = '';
        let type = '';
        let data: string[] = [];
        let bodyDone: () => void = () => {};
        const bodyEnded = new Promise<void>((done) => (bodyDone = done));

        const hand = () => {
          if (!waiting) return;
          if (taken < events.length) {
            const { resolve: give } = waiting;
            waiting = null;
            give(events[taken++]);
          } else if (finished) {
            const { reject: fail } = waiting;
            waiting = null;
            fail(new Error(`the stream ended after ${events.length} events`));
          }
        };
        const line = (row: string) => {
          if (row === '') {
            if (data.length) {
              events.push({
                type: type || 'message',
                id: lastId,
                data: data.join('\n'),
                receivedAt: performance.now(),
              });
            }
            type = '';
            data = [];
            return;
          }
          if (row.startsWith(':')) {
            comments.push(row.slice(1).trim());
            return;
          }
          const colon = row.indexOf(':');
          const field = colon < 0 ? row : row.slice(0, colon);
          let value = colon < 0 ? '' : row.slice(colon + 1);
          if (value.startsWith(' ')) value = value.slice(1);
          if (field === 'event') type = value;
          else if (field === 'data') data.push(value);
          else if (field === 'id' && !value.includes('\0')) lastId = value;
          else if (field === 'retry' && /^\d+$/.test(value)) retry = Number(value);
        };
        res.on('data', (chunk: string) => {
          text += chunk;
          let buffer = pending + chunk;
          // A CR at the very end may be the first half of a CRLF: keep it for the next chunk.
          const held = buffer.endsWith('\r') ? '\r' : '';
          if (held) buffer = buffer.slice(0, -1);
          const rows = buffer.split(/\r\n|\r|\n/);
          pending = (rows.pop() ?? '') + held;
          rows.forEach(line);
          hand();
        });
        const ended = new Promise<void>((done) => {
          const stop = () => {
            if (finished) return;
            finished = true;
            bodyDone();
            hand();
            done();
          };
          res.on('end', stop);
          res.on('close', stop);
          res.on('error', stop);
        });
        resolve({
          status: res.statusCode ?? 0,
          headers: res.headers,
          body: () => bodyEnded.then(() => text),
          events,
          comments,
          get retry() {
            return retry;
          },
          next: () =>
            new Promise((give, fail) => {
              waiting = { resolve: give, reject: fail };
              hand();
            }),
          ended,
          close: () => request.destroy(),
        });
      },
    );
    request.on('error', reject);
  });
}
