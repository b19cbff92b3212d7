import { NextResponse, type NextRequest } from 'next/server';
import { z, ZodError, type ZodType } from 'zod';
import { HttpError, badRequest, tooLarge } from './errors';

export interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

/**
 * Maps zod issues to { "a.b": "message" } so a form can show each next to its field. Collected in a
 * Map: the keys come from the request, and assigning `fields["__proto__"]` on a plain object would
 * set its prototype instead of naming the unknown field.
 */
export function zodFields(err: ZodError): Record<string, string> {
  const fields = new Map<string, string>();
  for (const issue of err.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields.set([...issue.path, k].join('.'), 'Unknown field; remove it.');
      continue;
    }
    const key = issue.path.length ? issue.path.join('.') : '(body)';
    if (!fields.has(key)) fields.set(key, issue.message);
  }
  return Object.fromEntries(fields);
}

export function errorResponse(err: unknown): NextResponse<ErrorBody> {
  if (err instanceof HttpError) {
    return NextResponse.json(
      { error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } },
      { status: err.status, headers: err.headers },
    );
  }
  if (err instanceof ZodError) {
    const fields = zodFields(err);
    const first = Object.entries(fields)[0];
    const message = first ? `Check the field "${first[0]}": ${first[1]}` : 'The request is not valid.';
    return NextResponse.json({ error: { code: 'invalid', message, fields } }, { status: 422 });
  }
  console.error('[api] unexpected error', err);
  return NextResponse.json(
    { error: { code: 'internal', message: 'Something went wrong on our side. Try again; if it persists, tell your coordinator.' } },
    { status: 500 },
  );
}

type Ctx<P> = { params: Promise<P> };

/** Wraps a route handler: every thrown HttpError/ZodError becomes the one error shape. */
export function route<P = Record<string, string>>(
  fn: (req: NextRequest, ctx: Ctx<P>) => Promise<Response>,
): (req: NextRequest, ctx: Ctx<P>) => Promise<Response> {
  return async (req, ctx) => {
    try {
      return await fn(req, ctx);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

export const DEFAULT_BODY_LIMIT = 256 * 1024;

/**
 * Reads the body as bytes under a size limit (413 beyond it), without trusting Content-Length alone.
 * @param tooLargeError the error to throw instead of the generic 413 (e.g. one naming the file limit)
 */
export async function readBodyBytes(req: Request, limitBytes = DEFAULT_BODY_LIMIT, tooLargeError: HttpError = tooLarge(limitBytes)): Promise<Buffer> {
  const declared = Number(req.headers.get('content-length') ?? '0');
  if (declared > limitBytes) throw tooLargeError;
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limitBytes) {
      await reader.cancel();
      throw tooLargeError;
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** Reads the body as text under a size limit (413 beyond it), without trusting Content-Length alone. */
export async function readBodyText(req: Request, limitBytes = DEFAULT_BODY_LIMIT): Promise<string> {
  return (await readBodyBytes(req, limitBytes)).toString('utf8');
}

/**
 * Reads a multipart/form-data body under a size limit (413 beyond it) and parses it; 400 when it is not
 * multipart or cannot be parsed.
 */
export async function parseMultipart(req: Request, limitBytes: number, tooLargeError?: HttpError): Promise<FormData> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;\s*boundary=/i.test(type)) throw badRequest('Send the form as multipart/form-data.');
  const bytes = await readBodyBytes(req, limitBytes, tooLargeError);
  try {
    return await new Request('http://local/', { method: 'POST', headers: { 'content-type': type }, body: new Uint8Array(bytes) }).formData();
  } catch {
    throw badRequest('The multipart form could not be read.');
  }
}

/** Parses a JSON body and validates it; 400 for malformed JSON, 422 for a wrong shape, 413 when too large. */
export async function parseJson<T extends ZodType>(req: Request, schema: T, limitBytes = DEFAULT_BODY_LIMIT): Promise<z.infer<T>> {
  const text = await readBodyText(req, limitBytes);
  if (!text.trim()) throw badRequest('The request body is empty; send a JSON object.');
  // Only JSON is taken: a form on another site can post text/plain or form data without a
  // pre-flight, but not application/json, so this also closes cross-site form posts (e.g. login CSRF).
  const type = req.headers.get('content-type') ?? '';
  if (!/^application\/(.+\+)?json\b/i.test(type.trim())) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the body as JSON with the header Content-Type: application/json.');
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw badRequest('The request body is not valid JSON.');
  }
  return schema.parse(data);
}

/** Validates the query string against a schema (422 naming the parameter). */
export function parseQuery<T extends ZodType>(req: NextRequest, schema: T): z.infer<T> {
  return schema.parse(Object.fromEntries(req.nextUrl.searchParams.entries()));
}

export const json = <T>(data: T, init?: ResponseInit) => NextResponse.json(data, init);
