import { isUuid } from '@/lib/auth/guard';
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { CookerSchema, StorageMediumSchema, type Cooker, type Kitchen } from '@/entities';
import type { KitchenAccess, Viewer } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { notFound, unprocessable } from '@/lib/http/errors';
import { getMedium, listMedia } from '@/lib/materials';
import type { CookerInput } from '@/lib/validations/cookers';
import { addDays, localDateString } from '@/lib/time';
import { normalisePots } from './spec';

export { toApertureGeometry, toCookerSpec } from './spec';
export { cookerMedium } from './medium';
import { cookerMedium } from './medium';

export function describeCooker(c: Cooker) {
  return {
    id: c.id,
    kitchenId: c.kitchen.id,
    name: c.name,
    kind: c.kind,
    apertureM2: c.apertureM2,
    tracking: c.tracking,
    tiltDeg: c.tiltDeg,
    surfaceAzimuthDeg: c.surfaceAzimuthDeg,
    collectorModel: c.collectorModel,
    eta0: c.eta0,
    a1: c.a1,
    a2: c.a2,
    uLossWPerK: c.uLossWPerK,
    mediumId: c.mediumId,
    customMediumId: c.customMedium?.id ?? null,
    mediumName: cookerMedium(c).name,
    storeMassKg: c.storeMassKg,
    storeUaWPerK: c.storeUaWPerK,
    storeNodes: c.storeNodes,
    maxSafeTempC: c.maxSafeTempC,
    minUsefulTempC: c.minUsefulTempC,
    pots: c.pots,
    updatedAt: c.updatedAt.toISOString(),
  };
}


/** Checks the medium choice against the organisation's custom media and the medium's limits. */
async function resolveMediumChoice(em: EntityManager, kitchen: Kitchen, input: Partial<CookerInput>) {
  if (input.mediumId === 'custom') {
    const custom = await em.findOne(StorageMediumSchema, { id: input.customMediumId!, organisation: kitchen.organisation.id });
    if (!custom) throw unprocessable('Choose a custom medium of your organisation.', { customMediumId: 'Unknown custom medium.' });
    return custom;
  }
  if (input.mediumId && input.maxSafeTempC !== undefined) {
    const m = getMedium(input.mediumId);
    if (input.maxSafeTempC > m.recommendedMaxC) {
      throw unprocessable(`The highest safe temperature is above what we recommend for ${m.name}.`, {
        maxSafeTempC: `At most ${m.recommendedMaxC} °C for ${m.name}${m.smokePointC ? ` (smoke point ${m.smokePointC} °C)` : ''}.`,
      });
    }
  }
  return null;
}

/** A kitchen's cookers in use (not archived), by name, with their custom medium. */
export async function getActiveCookers(em: EntityManager, kitchenId: string) {
  return em.find(CookerSchema, { kitchen: kitchenId, archived: false }, { orderBy: { name: 'asc' }, populate: ['customMedium'] });
}

export async function listCookers(access: KitchenAccess) {
  return (await getActiveCookers(access.em, access.kitchen.id)).map(describeCooker);
}

export async function getCooker(access: KitchenAccess, cookerId: string): Promise<Cooker> {
  const c = isUuid(cookerId)
    ? await access.em.findOne(CookerSchema, { id: cookerId, kitchen: access.kitchen.id, archived: false }, { populate: ['customMedium', 'kitchen'] })
    : null;
  if (!c) throw notFound('Cooker');
  return c;
}

export async function createCooker(access: KitchenAccess, input: CookerInput) {
  const { em, kitchen } = access;
  const custom = await resolveMediumChoice(em, kitchen, input);
  const { customMediumId: _c, pots, ...rest } = input;
  const cooker = em.create(CookerSchema, { id: randomUUID(), ...rest, pots: normalisePots(pots), kitchen, customMedium: custom, archived: false });
  recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'cooker.create', entityType: 'Cooker', entityId: cooker.id, details: { name: cooker.name } });
  await em.flush();
  return describeCooker(cooker);
}

export async function updateCooker(access: KitchenAccess, cookerId: string, input: Partial<CookerInput>) {
  const { em, kitchen } = access;
  const cooker = await getCooker(access, cookerId);
  const merged = { ...describeCooker(cooker), ...input };
  if (merged.minUsefulTempC >= merged.maxSafeTempC - 5) {
    throw unprocessable('The lowest useful temperature must be at least 5 °C below the highest safe one.', { minUsefulTempC: 'Must be at least 5 °C below the highest safe temperature.' });
  }
  const custom = await resolveMediumChoice(em, kitchen, { mediumId: merged.mediumId, customMediumId: merged.customMediumId, maxSafeTempC: merged.maxSafeTempC });
  const { customMediumId: _c, pots, ...rest } = input;
  em.assign(cooker, { ...rest, ...(pots ? { pots: normalisePots(pots) } : {}), customMedium: merged.mediumId === 'custom' ? custom : null });
  recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'cooker.update', entityType: 'Cooker', entityId: cooker.id, details: { fields: Object.keys(input) } });
  await em.flush();
  return describeCooker(cooker);
}

export async function archiveCooker(access: KitchenAccess, cookerId: string) {
  const { em, kitchen } = access;
  const cooker = await getCooker(access, cookerId);
  cooker.archived = true;
  recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'cooker.archive', entityType: 'Cooker', entityId: cooker.id });
  await em.flush();
}

/** Tomorrow (in the kitchen's zone) unless a date is given. */
export function defaultPredictionDate(kitchen: Kitchen, now = Date.now()): string {
  return addDays(localDateString(now, kitchen.timeZone), 1);
}

/** Built-in media and the organisation's custom ones, for the cooker form. */
export async function listStorageMedia(viewer: Viewer, organisationId: string) {
  const builtIn = listMedia().map((m) => ({
    id: m.id,
    name: m.name,
    kind: m.kind,
    builtIn: true,
    smokePointC: m.smokePointC ?? null,
    flashPointC: m.flashPointC ?? null,
    recommendedMaxC: m.recommendedMaxC,
    melting: m.melting ?? null,
    sources: m.sources,
  }));
  const custom = await viewer.em.find(StorageMediumSchema, { organisation: organisationId }, { orderBy: { name: 'asc' } });
  return [
    ...builtIn,
    ...custom.map((m) => ({ id: m.id, name: m.name, kind: 'custom' as const, builtIn: false, smokePointC: m.smokePointC, flashPointC: null, recommendedMaxC: m.smokePointC ? m.smokePointC - 30 : null, melting: null, sources: m.source ? [m.source] : [] })),
  ];
}
