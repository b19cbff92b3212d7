import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { getEm } from '@/lib/db';
import { getEnv } from '@/lib/env';
import { authenticateApiKey } from '@/lib/cooks/api-keys';
import { enforceRateLimit } from '@/lib/cooks/rate-limit';
import { recordSensorReadings } from '@/lib/cooks/readings';
import { sensorReadingsSchema } from '@/lib/validations/cooks';

/**
 * Readings from a sensor, authenticated by its cooker API key (`Authorization: Bearer <key>`), not a
 * session: the key names the cooker. Key first (401), then the rate limit (429 with Retry-After),
 * then the body (400/413/422 naming the row).
 */
export const POST = route(async (req: NextRequest) => {
  const em = await getEm();
  const key = await authenticateApiKey(em, req.headers.get('authorization'));
  await enforceRateLimit(em, `sensor:${key.id}`, getEnv().READINGS_RATE_PER_MIN, 60);
  const input = await parseJson(req, sensorReadingsSchema, 128 * 1024);
  const r = await recordSensorReadings(em, key, input);
  return json(r.body, { status: r.status });
});
