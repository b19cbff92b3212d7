import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireViewer } from '@/lib/auth/guard';
import { inlineProblemSchema } from '@/lib/validations/planner';
import { solveInlineProblem } from '@/lib/plans/inline';

/** Solves an inline planning problem (any signed-in user; it touches no stored data). */
export const POST = route(async (req: NextRequest) => {
  await requireViewer();
  const input = await parseJson(req, inlineProblemSchema, 8 * 1024 * 1024);
  return json(await solveInlineProblem(input));
});
