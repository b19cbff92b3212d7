/**
 * Role × action × own/other kitchen. Every kitchen-scoped route goes through one guard; this
 * matrix checks it over HTTP: visible + allowed → 2xx; visible + not allowed → 403;
 * another kitchen of another organisation, or a kitchen a lead/cook is not in → 404.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';

let w: World;
const clients: Record<string, Client> = {};
beforeAll(async () => {
  w = await createWorld();
  for (const who of ['coordinator', 'leadA', 'cookA', 'otherCoordinator'] as const) clients[who] = await new Client().signIn(w.emails[who], PASSWORD);
});
afterAll(closeTestOrm);

type Target = 'own' | 'sibling' | 'foreign';
const kitchenOf = (who: string, target: Target) => {
  if (target === 'foreign') return w.otherKitchen.id;
  if (target === 'sibling') return who === 'otherCoordinator' ? w.kitchenA.id : w.kitchenB.id;
  return who === 'otherCoordinator' ? w.otherKitchen.id : w.kitchenA.id;
};

// read: GET kitchen; manage-kitchen: PATCH kitchen (coordinator only)
const cases: [who: string, target: Target, action: 'read' | 'manage', expected: number][] = [
  ['coordinator', 'own', 'read', 200],
  ['coordinator', 'sibling', 'read', 200], // every kitchen of the organisation
  ['coordinator', 'foreign', 'read', 404],
  ['coordinator', 'own', 'manage', 200],
  ['coordinator', 'foreign', 'manage', 404],
  ['leadA', 'own', 'read', 200],
  ['leadA', 'sibling', 'read', 404], // same organisation, not their kitchen
  ['leadA', 'foreign', 'read', 404],
  ['leadA', 'own', 'manage', 403],
  ['leadA', 'sibling', 'manage', 404],
  ['cookA', 'own', 'read', 200],
  ['cookA', 'own', 'manage', 403],
  ['cookA', 'sibling', 'read', 404],
  ['cookA', 'foreign', 'manage', 404],
  ['otherCoordinator', 'own', 'read', 200],
  ['otherCoordinator', 'sibling', 'read', 404],
];

describe('kitchen guard matrix', () => {
  it.each(cases)('%s → %s kitchen, %s → %i', async (who, target, action, expected) => {
    const id = kitchenOf(who, target);
    const c = clients[who]!;
    const r = action === 'read' ? await c.get(`/api/v1/kitchens/${id}`) : await c.patch(`/api/v1/kitchens/${id}`, { altitudeM: 301 });
    expect(r.status).toBe(expected);
    if (expected === 404) expect(r.json.error.message).toBe('Kitchen not found.');
  });

  it('members list follows the same rule', async () => {
    expect((await clients.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/members`)).status).toBe(200);
    expect((await clients.cookA!.get(`/api/v1/kitchens/${w.kitchenB.id}/members`)).status).toBe(404);
  });

  it('a malformed or unknown kitchen id is 404, not 500', async () => {
    expect((await clients.coordinator!.get('/api/v1/kitchens/not-a-uuid')).status).toBe(404);
    expect((await clients.coordinator!.get('/api/v1/kitchens/00000000-0000-4000-8000-000000000000')).status).toBe(404);
  });

  it('only coordinators create kitchens', async () => {
    const body = { name: 'New kitchen', latitude: 10, longitude: 10, altitudeM: 100, timeZone: 'Africa/Lagos', locale: 'en' };
    expect((await clients.leadA!.post('/api/v1/kitchens', body)).status).toBe(403);
    expect((await clients.cookA!.post('/api/v1/kitchens', body)).status).toBe(403);
    const ok = await clients.coordinator!.post('/api/v1/kitchens', body);
    expect(ok.status).toBe(201);
    expect(ok.json.organisation.id).toBe(w.org.id);
  });

  it('invitations: cooks cannot invite; leads invite cooks to their own kitchen only; coordinators invite coordinators', async () => {
    const cook = await clients.cookA!.post('/api/v1/invitations', { email: 'a1@example.org', role: 'cook', kitchenId: w.kitchenA.id });
    expect(cook.status).toBe(403);
    const leadOwn = await clients.leadA!.post('/api/v1/invitations', { email: 'a2@example.org', role: 'cook', kitchenId: w.kitchenA.id });
    expect(leadOwn.status).toBe(201);
    const leadOther = await clients.leadA!.post('/api/v1/invitations', { email: 'a3@example.org', role: 'cook', kitchenId: w.kitchenB.id });
    expect(leadOther.status).toBe(404);
    const leadCoord = await clients.leadA!.post('/api/v1/invitations', { email: 'a4@example.org', role: 'coordinator' });
    expect(leadCoord.status).toBe(403);
    const coord = await clients.coordinator!.post('/api/v1/invitations', { email: 'a5@example.org', role: 'coordinator' });
    expect(coord.status).toBe(201);
  });
});
