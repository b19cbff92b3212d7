import { z, type ZodType } from 'zod';

/** One documented operation; route modules register theirs so the document follows the code. */
export interface Operation {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  path: string;
  summary: string;
  tag: string;
  /** Roles allowed; empty = public. */
  roles: string[];
  body?: ZodType;
  /** Media type of the body; default JSON. */
  bodyType?: 'application/json' | 'multipart/form-data';
  query?: ZodType;
  /** Response schema of the success status, if JSON. */
  response?: ZodType;
  successStatus?: number;
  errors?: number[];
  /** How the caller authenticates when not by session: a cooker API key as a Bearer token (sensors). */
  auth?: 'cookerKey';
}

const errorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string' },
        message: { type: 'string', description: 'A sentence a person can act on.' },
        fields: { type: 'object', additionalProperties: { type: 'string' }, description: 'Field path → message.' },
      },
    },
  },
} as const;

const toSchema = (s: ZodType) => z.toJSONSchema(s, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' });

/** A request body's schema, always with a `required` list (empty when every field is optional, e.g. a PATCH). */
function bodySchema(s: ZodType) {
  const schema = toSchema(s) as ReturnType<typeof toSchema> & { type?: unknown; required?: string[] };
  if (schema.type === 'object') schema.required ??= [];
  return schema;
}

/** Builds the OpenAPI 3.1 document from the operations. */
export function buildOpenApi(operations: Operation[], info: { version: string; serverUrl: string }) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of operations) {
    const params = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string', format: 'uuid' } }));
    if (op.query) {
      const q = toSchema(op.query) as { properties?: Record<string, unknown>; required?: string[] };
      for (const [name, schema] of Object.entries(q.properties ?? {})) params.push({ name, in: 'query', required: q.required?.includes(name) ?? false, schema: schema as never });
    }
    const responses: Record<string, unknown> = {
      [String(op.successStatus ?? 200)]: op.response
        ? { description: 'Success', content: { 'application/json': { schema: toSchema(op.response) } } }
        : { description: 'Success' },
    };
    for (const code of new Set([...(op.body ? [400, 413, 422] : []), ...(op.body && (op.bodyType ?? 'application/json') === 'application/json' ? [415] : []), ...(op.roles.length ? [401, 403, 404] : []), ...(op.auth ? [401] : []), ...(op.errors ?? [])])) {
      responses[String(code)] = { description: HTTP_TEXT[code] ?? 'Error', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    }
    (paths[op.path] ??= {})[op.method] = {
      summary: op.summary,
      tags: [op.tag],
      ...(op.auth === 'cookerKey'
        ? { security: [{ cookerKey: [] }], description: 'A cooker API key (made by the kitchen lead on the cooker page) as `Authorization: Bearer <key>`.' }
        : op.roles.length
          ? { security: [{ session: [] }], description: `Roles: ${op.roles.join(', ')}.` }
          : { security: [] }),
      ...(params.length ? { parameters: params } : {}),
      ...(op.body ? { requestBody: { required: true, content: { [op.bodyType ?? 'application/json']: { schema: bodySchema(op.body) } } } } : {}),
      responses,
    };
  }
  return {
    openapi: '3.1.0',
    info: { title: 'Hearthcast API', version: info.version, description: 'Planning for community kitchens that cook on stored-heat solar cookers.' },
    servers: [{ url: info.serverUrl }],
    components: {
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: 'hc_session', description: 'Set by POST /api/v1/session.' },
        cookerKey: { type: 'http', scheme: 'bearer', description: "A cooker's sensor key (hck_…), shown once when the lead makes it; revocable." },
      },
      schemas: { Error: errorSchema },
    },
    paths,
  };
}

const HTTP_TEXT: Record<number, string> = {
  400: 'Malformed request (e.g. not JSON)',
  401: 'Not signed in',
  403: 'Role does not allow this action',
  404: 'Not found, or not visible to the caller',
  409: 'Conflict',
  410: 'Link expired or already used',
  413: 'Body too large',
  415: 'Body not sent as application/json',
  422: 'Invalid fields (see error.fields)',
  429: 'Too many attempts (see Retry-After)',
};
