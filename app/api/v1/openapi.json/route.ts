import { json, route } from '@/lib/http/handler';
import { buildOpenApi } from '@/lib/openapi/registry';
import { operations } from '@/lib/openapi/operations';
import { cookerOperations } from '@/lib/openapi/cooker-operations';
import { planOperations } from '@/lib/openapi/plan-operations';
import { forecastOperations } from '@/lib/openapi/forecast-operations';
import { cooksOperations } from '@/lib/openapi/cooks-operations';
import { getEnv } from '@/lib/env';

export const GET = route(async () =>
  json(buildOpenApi([...operations, ...cookerOperations, ...forecastOperations, ...planOperations, ...cooksOperations], { version: '0.1.0', serverUrl: getEnv().APP_URL })),
);
