import type { NextRequest } from 'next/server';
import { json, parseQuery, route } from '@/lib/http/handler';
import { requireCoordinatorOrg, requireViewer } from '@/lib/auth/guard';
import { getOrganisationOverview } from '@/lib/plans/overview';
import { overviewQuery } from '@/lib/validations/plans';

/** Coordinators: the day across the organisation's kitchens (sun vs backup fuel, cost, CO₂). */
export const GET = route(async (req: NextRequest) => {
  const viewer = await requireViewer();
  const orgId = requireCoordinatorOrg(viewer);
  const q = parseQuery(req, overviewQuery);
  return json(await getOrganisationOverview(viewer, orgId, q.date));
});
