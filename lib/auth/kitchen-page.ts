import { cache } from 'react';
import { notFound } from 'next/navigation';
import { requireKitchen, type KitchenAccess } from './guard';
import type { Action } from './permissions';
import { roleCan } from './permissions';
import { HttpError } from '@/lib/http/errors';
import { getPageViewer } from './page';

/** For kitchen pages: the access, or notFound() for a kitchen the viewer cannot see or act on. Cached per request. */
export const getKitchenPageAccess = cache(async function getKitchenPageAccess(kitchenId: string, action: Action = 'read'): Promise<KitchenAccess & { canPlan: boolean }> {
  const viewer = await getPageViewer();
  try {
    const access = await requireKitchen(kitchenId, action, viewer);
    return { ...access, canPlan: roleCan(access.role, 'plan') };
  } catch (err) {
    if (err instanceof HttpError && (err.status === 404 || err.status === 403)) notFound();
    throw err;
  }
});
