/** Reading plans: one plan, a day's draft and published plan, and the API's view of a plan. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { PlanSchema, type Plan } from '@/entities';
import { isUuid, type KitchenAccess } from '@/lib/auth/guard';
import { notFound } from '@/lib/http/errors';
import { slotSafetyNotes } from '@/lib/safety/plan-notes';

export function describePlan(p: Plan) {
  return {
    id: p.id,
    kitchenId: p.kitchen.id,
    date: p.date,
    version: p.version,
    status: p.status,
    weatherSource: p.weatherSource,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
    publishedAt: p.publishedAt?.toISOString() ?? null,
    batches: p.batches,
    result: p.result,
    fuel: p.fuel,
    cookers: p.cookers,
    safety: slotSafetyNotes(p.batches, p.result, p.cookers),
  };
}
export type PlanDto = ReturnType<typeof describePlan>;

export async function getPlan(access: Pick<KitchenAccess, 'em' | 'kitchen'>, planId: string): Promise<Plan> {
  const p = isUuid(planId) ? await access.em.findOne(PlanSchema, { id: planId, kitchen: access.kitchen.id }, { populate: ['kitchen'] }) : null;
  if (!p) throw notFound('Plan');
  return p;
}

/** The day's latest published plan (the one cooks work from), or null. */
export async function getPublishedPlan(em: EntityManager, kitchenId: string, date: string): Promise<Plan | null> {
  return em.findOne(PlanSchema, { kitchen: kitchenId, date, status: 'published' }, { orderBy: { version: 'desc' }, populate: ['kitchen'] });
}

/** The day's current draft and latest published plan (either may be missing). */
export async function getPlansForDate(access: Pick<KitchenAccess, 'em' | 'kitchen'>, date: string) {
  const [draft, published] = await Promise.all([
    access.em.findOne(PlanSchema, { kitchen: access.kitchen.id, date, status: 'draft' }, { populate: ['kitchen'] }),
    getPublishedPlan(access.em, access.kitchen.id, date),
  ]);
  return { draft: draft ? describePlan(draft) : null, published: published ? describePlan(published) : null };
}
