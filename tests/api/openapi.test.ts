/**
 * The OpenAPI document against the code: every route file under app/api/v1 (dev/ aside) and each
 * HTTP method it exports is documented, nothing else is, and every request body has a JSON schema
 * whose `required` list is what the API itself names as missing when it gets `{}`.
 */
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';

const API_DIR = path.resolve('app/api/v1');
const METHODS = ['GET', 'POST', 'PATCH', 'PUT', 'DELETE'] as const;

interface RouteFile {
  /** URL template as OpenAPI writes it, e.g. /api/v1/kitchens/{kitchenId}/members */
  path: string;
  file: string;
  methods: string[];
  /** The file reads a JSON or multipart body (parseJson, parseMultipart). */
  readsBody: boolean;
}

async function routeFiles(): Promise<RouteFile[]> {
  const entries = await readdir(API_DIR, { recursive: true, withFileTypes: true });
  const files = entries.filter((e) => e.isFile() && e.name === 'route.ts').map((e) => path.join(e.parentPath, e.name));
  const out: RouteFile[] = [];
  for (const file of files) {
    const rel = path.relative(API_DIR, path.dirname(file)).split(path.sep);
    if (rel[0] === 'dev') continue; // dev tools only, not part of the API
    if (rel.some((seg) => seg.startsWith('[...'))) continue; // the catch-all answering unknown paths with 404
    const source = await readFile(file, 'utf8');
    const methods = METHODS.filter((m) => new RegExp(`export\\s+(const\\s+${m}\\b|(async\\s+)?function\\s+${m}\\b)`).test(source));
    const segments = rel.filter((s) => s !== '').map((s) => s.replace(/^\[(\w+)\]$/, '{$1}'));
    out.push({ path: ['/api/v1', ...segments].join('/'), file: path.relative(process.cwd(), file), methods, readsBody: /\b(parseJson|parseMultipart)\(/.test(source) });
  }
  return out.sort((a, b) => a.path.localeCompare(b.path));
}

interface JsonSchema {
  type?: string;
  properties?: Record<string, unknown>;
  required?: string[];
  additionalProperties?: boolean;
  minProperties?: number;
}
interface OperationDoc {
  requestBody?: { required: boolean; content: Partial<Record<'application/json' | 'multipart/form-data', { schema: JsonSchema }>> };
  description?: string;
  responses: Record<string, unknown>;
  security: unknown[];
}

let doc: { openapi: string; paths: Record<string, Record<string, OperationDoc>>; components: { schemas: Record<string, unknown> } };
let routes: RouteFile[];
let w: World;
let coordinator: Client;
let lead: Client;
let cook: Client;

beforeAll(async () => {
  const r = await new Client().get('/api/v1/openapi.json');
  expect(r.status).toBe(200);
  expect(r.headers.get('content-type')).toMatch(/application\/json/);
  doc = r.json as typeof doc;
  routes = await routeFiles();
  w = await createWorld();
  coordinator = await new Client().signIn(w.emails.coordinator, PASSWORD);
  lead = await new Client().signIn(w.emails.leadA, PASSWORD);
  cook = await new Client().signIn(w.emails.cookA, PASSWORD);
});
afterAll(closeTestOrm);

describe('GET /api/v1/openapi.json', () => {
  it('is OpenAPI 3.1, served without a session', () => {
    expect(doc.openapi).toMatch(/^3\.1\./);
    expect(doc.components.schemas).toHaveProperty('Error');
  });

  it('the route walk finds the routes (guards the walk itself)', () => {
    expect(routes.map((r) => r.path)).toEqual(expect.arrayContaining(['/api/v1/session', '/api/v1/kitchens/{kitchenId}', '/api/v1/kitchens/{kitchenId}/members']));
    expect(routes.every((r) => r.methods.length > 0)).toBe(true);
    expect(routes.some((r) => r.path.includes('/dev/'))).toBe(false);
  });

  it('documents every route file with each method it exports', () => {
    const missing = routes.flatMap((r) => r.methods.filter((m) => !doc.paths[r.path]?.[m.toLowerCase()]).map((m) => `${m} ${r.path} (${r.file})`));
    expect(missing).toEqual([]);
  });

  it('documents nothing that has no route file and method', () => {
    const byPath = new Map(routes.map((r) => [r.path, r]));
    const extra = Object.entries(doc.paths).flatMap(([p, ops]) =>
      Object.keys(ops)
        .filter((m) => !byPath.get(p)?.methods.includes(m.toUpperCase()))
        .map((m) => `${m.toUpperCase()} ${p}`),
    );
    expect(extra).toEqual([]);
  });

  it('every method of a file that reads a JSON body has a request body; GET and DELETE have none', () => {
    for (const r of routes) {
      for (const m of r.methods) {
        const op = doc.paths[r.path]![m.toLowerCase()]!;
        const hasBody = Boolean(op.requestBody);
        expect(hasBody, `${m} ${r.path}`).toBe(r.readsBody && ['POST', 'PATCH', 'PUT'].includes(m));
      }
    }
  });

  it('request bodies are strict JSON object schemas with a `required` list, and 400/413/422 documented', () => {
    // JSON bodies only; file uploads (multipart/form-data) are checked by their own tests.
    const bodies = Object.entries(doc.paths).flatMap(([p, ops]) => Object.entries(ops).filter(([, op]) => op.requestBody?.content['application/json']).map(([m, op]) => [`${m} ${p}`, op] as const));
    expect(bodies.length).toBeGreaterThanOrEqual(8);
    for (const [name, op] of bodies) {
      expect(op.requestBody!.required, name).toBe(true);
      const schema = op.requestBody!.content['application/json']!.schema;
      expect(schema.type, name).toBe('object');
      expect(schema.additionalProperties, name).toBe(false);
      expect(Array.isArray(schema.required), `${name} has a required list`).toBe(true);
      for (const f of schema.required!) expect(schema.properties, name).toHaveProperty([f]);
      for (const code of ['400', '413', '422']) expect(op.responses, `${name} documents ${code}`).toHaveProperty([code]);
    }
  });

  it('the `required` lists are what the API names as missing for {}; an all-optional body says minProperties 1', async () => {
    for (const [p, ops] of Object.entries(doc.paths)) {
      for (const [m, op] of Object.entries(ops)) {
        const json = op.requestBody?.content['application/json'];
        if (!json) continue;
        // Sensor routes authenticate by cooker API key before reading the body (tests/api/cooks.test.ts checks theirs).
        if (op.security.some((s) => typeof s === 'object' && s !== null && 'cookerKey' in s)) continue;
        const schema = json.schema;
        // Placeholders other than the kitchen get a well-formed value; bodies are validated before any lookup.
        const url = p.replace('{kitchenId}', w.kitchenA.id).replace('{date}', '2026-12-03').replace(/\{\w+\}/g, '00000000-0000-4000-8000-000000000000');
        // Ask as a role the operation allows (its description lists them), so the guard lets the body through.
        const roles = /Roles: ([^.]+)\./.exec(op.description ?? '')?.[1]?.split(', ') ?? [];
        const client = roles.length === 0 || roles.includes('coordinator') ? coordinator : roles.includes('lead') ? lead : cook;
        const r = await client.request(m.toUpperCase(), url, {});
        expect(r.status, `${m} ${p}`).toBe(422);
        const named = Object.keys(r.json.error.fields as Record<string, string>).filter((f) => f !== '(body)');
        expect(named.sort(), `${m} ${p}`).toEqual([...schema.required!].sort());
        if (schema.required!.length === 0) expect(schema.minProperties, `${m} ${p}`).toBe(1);
      }
    }
  });

  it('operations that need a session say so; public ones have no security', () => {
    expect(doc.paths['/api/v1/me']!.get!.security).toEqual([{ session: [] }]);
    expect(doc.paths['/api/v1/password-resets']!.post!.security).toEqual([]);
    expect(doc.paths['/api/v1/invitations/accept']!.post!.responses).toHaveProperty(['410']);
  });
});
