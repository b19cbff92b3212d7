import { z } from 'zod';
import type { Operation } from './registry';
import { signInSchema } from '@/lib/validations/session';
import { acceptInvitationSchema, confirmResetSchema, createInvitationSchema, requestResetSchema, updateMeSchema } from '@/lib/validations/users';
import { createKitchenSchema, updateKitchenSchema } from '@/lib/validations/kitchens';

const ALL = ['coordinator', 'lead', 'cook'];

const kitchen = z.object({
  id: z.uuid(),
  name: z.string(),
  organisation: z.object({ id: z.uuid(), name: z.string() }),
  latitude: z.number().describe('[°]'),
  longitude: z.number().describe('[°]'),
  altitudeM: z.number().describe('[m]'),
  timeZone: z.string(),
  locale: z.string(),
  clearness: z.object({ values: z.array(z.number()).describe('monthly clear-sky index of the clear-sky fallback, January … December [0–1]'), isDefault: z.boolean() }),
  role: z.enum(['coordinator', 'lead', 'cook']).optional(),
});
const me = z.object({
  user: z.object({ id: z.uuid(), email: z.string(), name: z.string(), locale: z.string(), temperatureUnit: z.enum(['C', 'F']) }),
  memberships: z.array(z.object({ id: z.uuid(), role: z.string(), organisation: z.object({ id: z.uuid(), name: z.string() }), kitchen: z.object({ id: z.uuid(), name: z.string() }).nullable() })),
});

/** Every operation of the API, in one list (the OpenAPI document is generated from it). */
export const operations: Operation[] = [
  { method: 'post', path: '/api/v1/session', summary: 'Sign in (sets the session cookie)', tag: 'session', roles: [], body: signInSchema, errors: [401, 429] },
  { method: 'delete', path: '/api/v1/session', summary: 'Sign out', tag: 'session', roles: [], successStatus: 204 },
  { method: 'get', path: '/api/v1/me', summary: 'The caller and their memberships', tag: 'session', roles: ALL, response: me },
  { method: 'patch', path: '/api/v1/me', summary: "Change the caller's name, language or temperature unit", tag: 'session', roles: ALL, body: updateMeSchema, response: me },
  { method: 'get', path: '/api/v1/kitchens', summary: "The caller's kitchens", tag: 'kitchens', roles: ALL, response: z.object({ kitchens: z.array(kitchen) }) },
  { method: 'post', path: '/api/v1/kitchens', summary: 'Add a kitchen to the organisation', tag: 'kitchens', roles: ['coordinator'], body: createKitchenSchema, response: kitchen, successStatus: 201 },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}', summary: 'One kitchen', tag: 'kitchens', roles: ALL, response: kitchen },
  { method: 'patch', path: '/api/v1/kitchens/{kitchenId}', summary: 'Change a kitchen', tag: 'kitchens', roles: ['coordinator'], body: updateKitchenSchema, response: kitchen },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/members', summary: "People of a kitchen", tag: 'kitchens', roles: ALL },
  { method: 'post', path: '/api/v1/invitations', summary: 'Invite someone by e-mail', tag: 'people', roles: ['coordinator', 'lead'], body: createInvitationSchema, successStatus: 201 },
  { method: 'post', path: '/api/v1/invitations/accept', summary: 'Accept an invitation with the one-time token', tag: 'people', roles: [], body: acceptInvitationSchema, errors: [410] },
  { method: 'post', path: '/api/v1/password-resets', summary: 'Ask for a password-reset link (always 202)', tag: 'session', roles: [], body: requestResetSchema, successStatus: 202 },
  { method: 'post', path: '/api/v1/password-resets/confirm', summary: 'Set a new password with the one-time token', tag: 'session', roles: [], body: confirmResetSchema, errors: [410] },
  { method: 'get', path: '/api/v1/health', summary: 'Liveness with a database round trip', tag: 'system', roles: [] },
  { method: 'get', path: '/api/v1/openapi.json', summary: 'This document', tag: 'system', roles: [] },
];
