import { inject } from 'vitest';

/** A tiny HTTP client for the API tests, carrying the session cookie like a browser would. */
export class Client {
  cookie = '';
  constructor(readonly baseUrl = inject('baseUrl'), readonly ip = `10.${rand()}.${rand()}.${rand()}`) {}

  async request(method: string, path: string, body?: unknown, opts: { raw?: string | Buffer; headers?: Record<string, string> } = {}) {
    const headers: Record<string, string> = { 'x-forwarded-for': this.ip, ...opts.headers };
    if (this.cookie) headers.cookie = this.cookie;
    let payload: string | Uint8Array<ArrayBuffer> | undefined;
    if (opts.raw !== undefined) {
      // A Buffer may sit on a shared ArrayBufferLike, which fetch's BodyInit type does not take; copy it.
      payload = typeof opts.raw === 'string' ? opts.raw : new Uint8Array(opts.raw);
      headers['content-type'] ??= 'application/json';
    } else if (body !== undefined) {
      payload = JSON.stringify(body);
      headers['content-type'] = 'application/json';
    }
    const res = await fetch(this.baseUrl + path, { method, headers, body: payload, redirect: 'manual' });
    const set = res.headers.getSetCookie();
    for (const c of set) {
      const pair = c.split(';')[0]!;
      if (pair.startsWith('hc_session=')) this.cookie = pair.endsWith('=') ? '' : pair;
    }
    return readResponse(res);
  }

  /** POST a multipart form (e.g. a file upload); fetch sets the boundary. */
  async postForm(path: string, form: FormData) {
    const headers: Record<string, string> = { 'x-forwarded-for': this.ip };
    if (this.cookie) headers.cookie = this.cookie;
    const res = await fetch(this.baseUrl + path, { method: 'POST', headers, body: form, redirect: 'manual' });
    return readResponse(res);
  }

  get = (p: string) => this.request('GET', p);
  post = (p: string, b?: unknown) => this.request('POST', p, b);
  patch = (p: string, b?: unknown) => this.request('PATCH', p, b);
  del = (p: string) => this.request('DELETE', p);

  async signIn(email: string, password: string) {
    const r = await this.post('/api/v1/session', { email, password });
    if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${r.text}`);
    return this;
  }
}

function rand() {
  return Math.floor(Math.random() * 250) + 1;
}

/** Status, headers, text and (when the body is JSON) the parsed body of a response. */
async function readResponse(res: Response) {
  const text = await res.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = null;
  }
  // Tests read bodies of every shape and assert on them; typing each would not make them safer.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return { status: res.status, headers: res.headers, json: json as Record<string, any>, text };
}
