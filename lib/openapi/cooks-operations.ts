import { z } from 'zod';
import type { Operation } from './registry';
import { apiKeySchema, checkInSchema, manualReadingSchema, pushSubscriptionSchema, readingsQuery, sensorReadingsSchema } from '@/lib/validations/cooks';

const ALL = ['coordinator', 'lead', 'cook'];
const LOGGERS = ['lead', 'cook'];

const checkIn = z.object({ id: z.uuid(), planId: z.uuid(), date: z.string(), batchId: z.string(), cookerId: z.uuid().nullable(), kind: z.enum(['started', 'done', 'skipped']), at: z.string(), userId: z.uuid().nullable() });
const reading = z.object({ id: z.uuid(), cookerId: z.uuid(), at: z.string(), storeC: z.number().nullable().describe('[°C]'), potC: z.number().nullable().describe('[°C]'), potId: z.string().nullable(), source: z.enum(['manual', 'sensor']) });
const apiKey = z.object({ id: z.uuid(), label: z.string(), prefix: z.string(), createdAt: z.string(), lastUsedAt: z.string().nullable(), revokedAt: z.string().nullable() });
const subscription = z.object({ id: z.uuid(), endpointHost: z.string(), createdAt: z.string(), lastSuccessAt: z.string().nullable() });
const slot = z.object({
  batchId: z.string(),
  dishName: z.string(),
  index: z.number(),
  of: z.number(),
  servings: z.number(),
  potId: z.string(),
  potName: z.string(),
  startMs: z.number().describe('[epoch ms]'),
  readyMs: z.number().nullable().describe('pot ≥ the dish minimum [epoch ms]; re-simulated from the latest reading when there is one; null: not reached'),
  doneMs: z.number().nullable(),
  plannedReadyMs: z.number(),
  readySource: z.enum(['plan', 'reading']),
  minTempC: z.number().describe('[°C]'),
  status: z.enum(['planned', 'started', 'done', 'skipped']).describe("the cooks' marks"),
  state: z.enum(['planned', 'due', 'late', 'missed', 'cooking', 'ready', 'done', 'skipped']).describe('where the slot stands at serverNowMs'),
  safety: z.array(z.object({ code: z.string(), level: z.enum(['danger', 'warning', 'info']), params: z.record(z.string(), z.union([z.string(), z.number()])).optional() })),
});
const today = z.object({
  kitchen: z.object({ id: z.uuid(), name: z.string(), timeZone: z.string() }),
  date: z.string().describe('kitchen-local date'),
  serverNowMs: z.number(),
  plan: z.object({ id: z.uuid(), version: z.number(), publishedAt: z.string().nullable() }).nullable().describe('null when no plan is published today'),
  cookers: z.array(z.object({ id: z.uuid(), name: z.string(), storeNowC: z.number().nullable(), repredictedFromMs: z.number().nullable().describe('when the re-prediction from the latest reading starts; null: the plan’s prediction'), slots: z.array(slot) })),
  backup: z.array(z.object({ batchId: z.string(), reason: z.string(), fuelId: z.string().nullable(), amount: z.number().nullable(), unit: z.string().nullable() })),
  warnings: z.array(z.object({ kind: z.enum(['store-low', 'smoke-point', 'ready-after-serve-by']), cookerId: z.uuid() })),
  servings: z.object({ total: z.number(), onSun: z.number(), backup: z.number() }),
  tomorrow: z.object({ date: z.string(), servings: z.object({ total: z.number(), onSun: z.number(), backup: z.number() }) }).nullable().describe("tomorrow's published plan (same shape as today's cookers and backup), or null"),
  vapidPublicKey: z.string().describe('applicationServerKey for PushManager.subscribe'),
});

/** The cooks' day: today's slots, check-ins, readings (manual and from sensors), sensor keys and push subscriptions. */
export const cooksOperations: Operation[] = [
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/today', summary: "Today's published plan for cooks (kitchen-local date): each slot's state, ready times re-predicted from the latest readings, safety notes; and tomorrow's published plan", tag: 'cooks', roles: ALL, response: today },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/check-ins', summary: 'A batch started, done or skipped (201; the same idempotency key again → 200 with the first answer)', tag: 'cooks', roles: LOGGERS, body: checkInSchema, response: checkIn, successStatus: 201, errors: [409] },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/readings', summary: 'A thermometer reading typed by a cook, in °C (201; the same idempotency key again → 200)', tag: 'cooks', roles: LOGGERS, body: manualReadingSchema, response: reading, successStatus: 201, errors: [409] },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}/readings', summary: "A cooker's readings of a local day (today by default)", tag: 'cooks', roles: ALL, query: readingsQuery, response: z.object({ date: z.string(), cookerId: z.uuid(), readings: z.array(reading) }) },
  {
    method: 'post',
    path: '/api/v1/readings',
    summary: "A sensor's batch of timestamped store and pot temperatures (in time order, −20…400 °C; refused rows named, e.g. readings.3.storeC); 60 requests a minute per key (429 with Retry-After)",
    tag: 'cooks',
    roles: [],
    auth: 'cookerKey',
    body: sensorReadingsSchema,
    response: z.object({ accepted: z.number(), cookerId: z.uuid(), from: z.string(), to: z.string() }),
    successStatus: 201,
    errors: [404, 409, 429],
  },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}/api-keys', summary: "The cooker's sensor keys (without the keys)", tag: 'cooks', roles: ['lead'], response: z.object({ keys: z.array(apiKey) }) },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}/api-keys', summary: 'Make a sensor key (the answer shows it once; only its SHA-256 is kept)', tag: 'cooks', roles: ['lead'], body: apiKeySchema, response: apiKey.extend({ key: z.string() }), successStatus: 201 },
  { method: 'delete', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}/api-keys/{keyId}', summary: 'Revoke a sensor key', tag: 'cooks', roles: ['lead'], successStatus: 204 },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/push-subscriptions', summary: "The caller's push subscriptions for this kitchen", tag: 'cooks', roles: ALL, response: z.object({ subscriptions: z.array(subscription) }) },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/push-subscriptions', summary: "Save a browser's push subscription (PushSubscription.toJSON()) for this kitchen's alerts (201 new, 200 updated)", tag: 'cooks', roles: ALL, body: pushSubscriptionSchema, response: subscription, successStatus: 201 },
  { method: 'delete', path: '/api/v1/kitchens/{kitchenId}/push-subscriptions/{subscriptionId}', summary: 'Remove one of your push subscriptions ({ endpointStillUsed }: whether another kitchen still uses the endpoint)', tag: 'cooks', roles: ALL },
];
