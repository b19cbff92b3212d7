import type { NextRequest } from 'next/server';
import { json, readBodyText, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { importDishes } from '@/lib/dishes';
import { badRequest } from '@/lib/http/errors';

/** Imports dishes from a CSV body (text/csv, at most 1 MiB); nothing is saved when any row has an error. */
export const POST = route<{ kitchenId: string }>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const text = await readBodyText(req, 1024 * 1024);
  if (!text.trim()) throw badRequest('The file is empty.');
  return json(await importDishes(access, access.kitchen.organisation.id, text));
});
