import { z } from 'zod';
import type { Operation } from './registry';
import { createCookerSchema, customMediumSchema, predictionQuerySchema, updateCookerSchema } from '@/lib/validations/cookers';
import { simulationSchema } from '@/lib/validations/simulations';

const ALL = ['coordinator', 'lead', 'cook'];

const prediction = z.object({
  date: z.string(),
  source: z.enum(['forecast', 'stale-forecast', 'upload', 'clear-sky']),
  timeZone: z.string(),
  initialStoreTempC: z.number().describe('[°C]'),
  series: z.object({
    t: z.array(z.number()).describe('[epoch ms]'),
    storeTempC: z.array(z.number()).describe('[°C]'),
    charge: z.array(z.number()).describe('state of charge [0–1]'),
    potTempC: z.record(z.string(), z.array(z.number().nullable())).describe('[°C], null while the pot is empty'),
    gApertureWm2: z.array(z.number()).describe('[W/m²]'),
    tAirC: z.array(z.number()).describe('[°C]'),
  }),
});

/** Cookers, storage media, predictions and the simulation endpoint. */
export const cookerOperations: Operation[] = [
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/cookers', summary: "The kitchen's cookers", tag: 'cookers', roles: ALL },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/cookers', summary: 'Register a cooker', tag: 'cookers', roles: ['lead'], body: createCookerSchema, successStatus: 201 },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}', summary: 'One cooker', tag: 'cookers', roles: ALL },
  { method: 'patch', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}', summary: 'Change a cooker', tag: 'cookers', roles: ['lead'], body: updateCookerSchema },
  { method: 'delete', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}', summary: 'Archive a cooker', tag: 'cookers', roles: ['lead'], successStatus: 204 },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}/prediction', summary: "A cooker's predicted day (tomorrow by default)", tag: 'cookers', roles: ALL, query: predictionQuerySchema, response: prediction },
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/media', summary: 'Built-in and custom storage media', tag: 'cookers', roles: ALL },
  { method: 'post', path: '/api/v1/kitchens/{kitchenId}/media', summary: 'Define a custom storage medium from a table', tag: 'cookers', roles: ['lead'], body: customMediumSchema, successStatus: 201 },
  { method: 'post', path: '/api/v1/simulations', summary: 'Run the cooker model on a weather series (stored or inline cooker)', tag: 'simulations', roles: ALL, body: simulationSchema },
];
