import type { StoredBatch } from '@/lib/plan-records';
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { DishSchema, MenuLineSchema, type Cooker, type Dish, type Kitchen, type MenuLine } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { unprocessable } from '@/lib/http/errors';
import type { z } from 'zod';
import type { menuLineSchema } from '@/lib/validations/menus';
import { zonedTimeToUtcMs } from '@/lib/time';

export function describeLine(l: MenuLine) {
  return { id: l.id, dishId: l.dish.id, dishName: l.dish.name, servings: l.servings, serveBy: l.serveBy, earliestStart: l.earliestStart, position: l.position };
}

export async function getMenuLines(em: EntityManager, kitchenId: string, date: string): Promise<MenuLine[]> {
  return em.find(MenuLineSchema, { kitchen: kitchenId, date }, { populate: ['dish'], orderBy: { position: 'asc' } });
}

/** Replaces the day's menu in one transaction (dishes must belong to the kitchen's organisation). */
export async function putMenu(access: KitchenAccess, date: string, lines: z.infer<typeof menuLineSchema>[]) {
  const { em, kitchen } = access;
  const dishIds = [...new Set(lines.map((l) => l.dishId))];
  const dishes = await em.find(DishSchema, { id: { $in: dishIds }, organisation: kitchen.organisation.id, archived: false });
  const byId = new Map(dishes.map((d) => [d.id, d]));
  const fields: Record<string, string> = {};
  lines.forEach((l, i) => {
    if (!byId.has(l.dishId)) fields[`lines.${i}.dishId`] = 'Unknown dish; choose one from your library.';
  });
  if (Object.keys(fields).length) throw unprocessable('The menu names a dish that is not in your library.', fields);
  await em.transactional(async (tx) => {
    await tx.nativeDelete(MenuLineSchema, { kitchen: kitchen.id, date });
    lines.forEach((l, i) =>
      tx.create(MenuLineSchema, { id: randomUUID(), kitchen: tx.getReference('Kitchen', kitchen.id) as Kitchen, date, dish: tx.getReference('Dish', l.dishId) as Dish, servings: l.servings, serveBy: l.serveBy, earliestStart: l.earliestStart ?? null, position: i }),
    );
    recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'menu.update', entityType: 'Menu', entityId: `${kitchen.id}:${date}`, details: { lines: lines.length } });
  });
  return (await getMenuLines(em, kitchen.id, date)).map(describeLine);
}

export async function copyMenu(access: KitchenAccess, fromDate: string, toDate: string) {
  const src = await getMenuLines(access.em, access.kitchen.id, fromDate);
  if (!src.length) throw unprocessable(`There is no menu on ${fromDate} to copy.`, { fromDate: 'That day has no menu.' });
  return putMenu(
    access,
    toDate,
    src.map((l) => ({ dishId: l.dish.id, servings: l.servings, serveBy: l.serveBy, earliestStart: l.earliestStart })),
  );
}

/** A batch of a menu line as planned and stored with the plan (entities/plan-records.ts). */
export type MenuBatch = StoredBatch;

/**
 * Splits menu lines into batches: as many as the recipe's batch size and the largest pot of the
 * kitchen require, servings spread evenly. A line whose one serving fits no pot still makes batches
 * (they go to backup fuel with the reason "pot too small").
 */
export function splitIntoBatches(lines: MenuLine[], cookers: Pick<Cooker, 'pots'>[], kitchen: Pick<Kitchen, 'timeZone' | 'planning'>, date: string): MenuBatch[] {
  const largestPotL = Math.max(0, ...cookers.flatMap((c) => c.pots.map((p) => p.volumeL)));
  const batches: MenuBatch[] = [];
  for (const l of lines) {
    const d = l.dish;
    const potCap = Math.floor(largestPotL / d.litresPerServing);
    const perBatch = Math.max(1, Math.min(d.servingsPerBatch, potCap > 0 ? potCap : d.servingsPerBatch));
    const n = Math.ceil(l.servings / perBatch);
    const base = Math.floor(l.servings / n);
    const extra = l.servings - base * n;
    const earliest = zonedTimeToUtcMs(date, kitchen.timeZone, ...hm(l.earliestStart ?? kitchen.planning.shiftStart));
    const serveBy = zonedTimeToUtcMs(date, kitchen.timeZone, ...hm(l.serveBy));
    for (let i = 0; i < n; i++) {
      const servings = base + (i < extra ? 1 : 0);
      batches.push({
        id: `${l.id}-${i + 1}`,
        lineId: l.id,
        dishId: d.id,
        dishName: d.name,
        method: d.method,
        servings,
        potVolumeNeededL: Math.round(servings * d.litresPerServing * 10) / 10,
        foodKg: servings * d.foodKgPerServing,
        foodCpJPerKgK: d.foodCpJPerKgK,
        waterKg: servings * d.waterKgPerServing,
        minTempC: d.minPotTempC,
        holdS: d.holdMin * 60,
        safeCoreTempC: d.safeCoreTempC,
        lidOn: d.lidOn,
        backupStove: d.backupStove,
        earliestStartMs: earliest,
        serveByMs: serveBy,
        index: i + 1,
        of: n,
      });
    }
  }
  return batches;
}

export function hm(s: string): [number, number] {
  const [h, m] = s.split(':').map(Number);
  return [h ?? 0, m ?? 0];
}
