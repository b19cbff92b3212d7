import type { Operation } from './registry';
import { createDishSchema, updateDishSchema } from '@/lib/validations/dishes';
import { copyMenuSchema, dateQuery, putMenuSchema } from '@/lib/validations/menus';
import { overviewQuery, patchSlotSchema, planningSettingsSchema, solvePlanSchema } from '@/lib/validations/plans';
import { inlineProblemSchema } from '@/lib/validations/planner';

const ALL = ['coordinator', 'lead', 'cook'];

/** Dishes, menus, plans, the organisation overview and the inline planner. */
export const planOperations: Operation[] = [
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/dishes', summary: "The organisation's dish library", tag: 'dishes', roles: ALL },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/dishes', summary: 'Add a dish', tag: 'dishes', roles: ['lead'], body: createDishSchema, successStatus: 201, errors: [409] },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/dishes/{dishId}', summary: 'One dish (with its derived batch heat)', tag: 'dishes', roles: ALL },
  { method: 'patch', path: '/api/v1/kitchens/{kitchenId}/dishes/{dishId}', summary: 'Change a dish', tag: 'dishes', roles: ['lead'], body: updateDishSchema, errors: [409] },
  { method: 'delete', path: '/api/v1/kitchens/{kitchenId}/dishes/{dishId}', summary: 'Archive a dish', tag: 'dishes', roles: ['lead'], successStatus: 204 },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/dishes/export', summary: 'The dish library as CSV', tag: 'dishes', roles: ALL },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/dishes/import', summary: 'Import dishes from CSV (text/csv body; all or nothing; errors name the line)', tag: 'dishes', roles: ['lead'], errors: [400, 413, 422] },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/menus/{date}', summary: "A day's menu", tag: 'menus', roles: ALL },
  { method: 'put', path: '/api/v1/kitchens/{kitchenId}/menus/{date}', summary: "Replace a day's menu", tag: 'menus', roles: ['lead'], body: putMenuSchema },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/menus/{date}/copy', summary: "Copy another day's menu onto this day", tag: 'menus', roles: ['lead'], body: copyMenuSchema },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/menus/{date}/batches', summary: "A day's menu split into batches", tag: 'menus', roles: ALL },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/planning-settings', summary: 'Shift, turnaround, currency, backup stoves and prices', tag: 'plans', roles: ALL },
  { method: 'put', path: '/api/v1/kitchens/{kitchenId}/planning-settings', summary: 'Change the planning settings', tag: 'plans', roles: ['lead'], body: planningSettingsSchema },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/plans', summary: "A day's draft and published plan", tag: 'plans', roles: ALL, query: dateQuery },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/plans', summary: 'Solve a draft plan for a day', tag: 'plans', roles: ['lead'], body: solvePlanSchema, successStatus: 201 },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/plans/{planId}', summary: 'One plan', tag: 'plans', roles: ALL },
  { method: 'patch', path: '/api/v1/kitchens/{kitchenId}/plans/{planId}/slots/{batchId}', summary: 'Move a slot of a draft (re-simulated; 409 with the reason when refused)', tag: 'plans', roles: ['lead'], body: patchSlotSchema, errors: [409] },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/plans/{planId}/publish', summary: 'Publish a draft as the next numbered, immutable version', tag: 'plans', roles: ['lead'], errors: [409] },
  { method: 'get', path: '/api/v1/organisation/overview', summary: 'The day across the organisation: sun vs backup fuel, cost, CO₂', tag: 'plans', roles: ['coordinator'], query: overviewQuery },
  { method: 'post', path: '/api/v1/planner/solve', summary: 'Solve an inline planning problem (plan, bound, gap, status, solve time)', tag: 'plans', roles: ALL, body: inlineProblemSchema },
];
