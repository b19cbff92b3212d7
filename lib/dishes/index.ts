import { isUuid } from '@/lib/auth/guard';
import { randomUUID } from 'node:crypto';
import Papa from 'papaparse';
import type { EntityManager } from '@mikro-orm/postgresql';
import { DishSchema, OrganisationSchema, type Dish } from '@/entities';
import type { Viewer } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, notFound, unprocessable } from '@/lib/http/errors';
import { estimateBatchHeat } from '@/lib/fuel';
import { createDishSchema, DISH_CSV_COLUMNS, type DishInput } from '@/lib/validations/dishes';
import { zodFields } from '@/lib/http/handler';

/** Heat to bring one full batch from 25 °C to its minimum pot temperature and hold it (lib/fuel estimate, sea level) [J]. */
export function batchHeatJ(d: Pick<Dish, 'method' | 'servingsPerBatch' | 'foodKgPerServing' | 'waterKgPerServing' | 'foodCpJPerKgK' | 'litresPerServing' | 'minPotTempC' | 'holdMin' | 'lidOn'>) {
  const h = estimateBatchHeat(
    {
      id: 'dish',
      method: d.method,
      potVolumeNeededL: d.servingsPerBatch * d.litresPerServing,
      foodKg: d.servingsPerBatch * d.foodKgPerServing,
      foodCpJPerKgK: d.foodCpJPerKgK,
      waterKg: d.servingsPerBatch * d.waterKgPerServing,
      minTempC: d.minPotTempC,
      holdS: d.holdMin * 60,
      lidOn: d.lidOn,
    },
    { ambientC: 25, altitudeM: 0 },
  );
  return { heatUpJ: h.heatingJ, totalJ: h.usefulJ };
}

export function describeDish(d: Dish) {
  const heat = batchHeatJ(d);
  return {
    id: d.id,
    name: d.name,
    method: d.method,
    servingsPerBatch: d.servingsPerBatch,
    foodKgPerServing: d.foodKgPerServing,
    waterKgPerServing: d.waterKgPerServing,
    foodCpJPerKgK: d.foodCpJPerKgK,
    litresPerServing: d.litresPerServing,
    minPotTempC: d.minPotTempC,
    holdMin: d.holdMin,
    safeCoreTempC: d.safeCoreTempC,
    lidOn: d.lidOn,
    backupStove: d.backupStove,
    notes: d.notes,
    /** Derived: heat to bring a full batch up to temperature [kWh], and with holding [kWh]. */
    heatUpKWh: heat.heatUpJ / 3.6e6,
    batchHeatKWh: heat.totalJ / 3.6e6,
  };
}

export async function listDishes(em: EntityManager, organisationId: string) {
  const dishes = await em.find(DishSchema, { organisation: organisationId, archived: false }, { orderBy: { name: 'asc' } });
  return dishes.map(describeDish);
}

export async function getDish(em: EntityManager, organisationId: string, dishId: string): Promise<Dish> {
  const d = isUuid(dishId) ? await em.findOne(DishSchema, { id: dishId, organisation: organisationId, archived: false }) : null;
  if (!d) throw notFound('Dish');
  return d;
}

/**
 * 409 when a live dish of the organisation has the name. An archived dish holding it is renamed
 * (flushed at once, before the caller's insert or rename reaches the unique index), so the name is
 * free and the archived dish keeps the menu lines of past days that point at it.
 */
async function claimName(em: EntityManager, organisationId: string, name: string, exceptId?: string) {
  const clash = await em.findOne(DishSchema, { organisation: organisationId, name, ...(exceptId ? { id: { $ne: exceptId } } : {}) });
  if (!clash) return;
  if (!clash.archived) throw conflict(`A dish called "${name}" already exists.`, { name: 'Choose another name; this one is taken.' });
  const suffix = ` (archived ${clash.id.slice(0, 8)})`;
  clash.name = `${name.slice(0, 200 - suffix.length)}${suffix}`;
  await em.flush();
}

export async function createDish(viewer: Viewer, organisationId: string, input: DishInput) {
  const { em } = viewer;
  await claimName(em, organisationId, input.name);
  const dish = em.create(DishSchema, { id: randomUUID(), ...input, notes: input.notes ?? null, organisation: em.getReference(OrganisationSchema, organisationId), archived: false });
  recordAudit(em, { organisationId, actorId: viewer.user.id, action: 'dish.create', entityType: 'Dish', entityId: dish.id, details: { name: dish.name } });
  await em.flush();
  return describeDish(dish);
}

export async function updateDish(viewer: Viewer, organisationId: string, dishId: string, input: Partial<DishInput>) {
  const { em } = viewer;
  const dish = await getDish(em, organisationId, dishId);
  const merged = { ...describeDish(dish), ...input };
  if (merged.minPotTempC < merged.safeCoreTempC) throw unprocessable('The pot must reach at least the safe core temperature.', { minPotTempC: 'Must be at least the safe core temperature.' });
  if (merged.foodKgPerServing === 0 && merged.waterKgPerServing === 0) throw unprocessable('A serving needs some food or water.', { foodKgPerServing: 'A serving needs some food or water.' });
  if (input.name && input.name !== dish.name) await claimName(em, organisationId, input.name, dish.id);
  em.assign(dish, input);
  recordAudit(em, { organisationId, actorId: viewer.user.id, action: 'dish.update', entityType: 'Dish', entityId: dish.id, details: { fields: Object.keys(input) } });
  await em.flush();
  return describeDish(dish);
}

export async function archiveDish(viewer: Viewer, organisationId: string, dishId: string) {
  const dish = await getDish(viewer.em, organisationId, dishId);
  dish.archived = true;
  recordAudit(viewer.em, { organisationId, actorId: viewer.user.id, action: 'dish.archive', entityType: 'Dish', entityId: dish.id });
  await viewer.em.flush();
}

/**
 * A text cell a spreadsheet will not run as a formula: a leading = + - @ (or tab/CR) gets a quote
 * (OWASP "CSV Injection"); the import takes the quote off again.
 */
export function safeCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}
const unsafeCell = (text: string) => (/^'[=+\-@\t\r]/.test(text) ? text.slice(1) : text);

/** CSV export with our documented header (DISH_CSV_COLUMNS). */
export function dishesToCsv(dishes: ReturnType<typeof describeDish>[]): string {
  return Papa.unparse({
    fields: [...DISH_CSV_COLUMNS],
    data: dishes.map((d) => [safeCell(d.name), d.method, d.servingsPerBatch, d.foodKgPerServing, d.waterKgPerServing, d.foodCpJPerKgK, d.litresPerServing, d.minPotTempC, d.holdMin, d.safeCoreTempC, d.lidOn ? 'yes' : 'no', d.backupStove, safeCell(d.notes ?? '')]),
  });
}

export interface CsvRowError {
  line: number;
  field: string;
  message: string;
}

/**
 * Parses a dish CSV. Every row is checked with the same schema as the form; errors name the line
 * (1 = header) and the column. Returns either all dishes or the first 20 errors — never a part.
 */
export function parseDishCsv(text: string): { dishes: DishInput[]; errors: CsvRowError[] } {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  const errors: CsvRowError[] = parsed.errors.slice(0, 20).map((e) => ({ line: (e.row ?? 0) + 1, field: '(row)', message: e.message }));
  const [header, ...rows] = parsed.data;
  if (!header) return { dishes: [], errors: [{ line: 1, field: '(file)', message: 'The file is empty.' }] };
  const cols = header.map((h) => h.trim().toLowerCase());
  const missing = DISH_CSV_COLUMNS.filter((c) => c !== 'notes' && !cols.includes(c));
  if (missing.length) return { dishes: [], errors: [{ line: 1, field: missing.join(', '), message: `Missing column(s): ${missing.join(', ')}. Expected header: ${DISH_CSV_COLUMNS.join(',')}` }] };
  const unknown = cols.filter((c) => !(DISH_CSV_COLUMNS as readonly string[]).includes(c));
  if (unknown.length) errors.push({ line: 1, field: unknown.join(', '), message: `Unknown column(s): ${unknown.join(', ')}.` });
  const dishes: DishInput[] = [];
  const names = new Set<string>();
  rows.forEach((row, i) => {
    const line = i + 2;
    if (row.length !== cols.length) {
      errors.push({ line, field: '(row)', message: `Expected ${cols.length} fields, found ${row.length}.` });
      return;
    }
    const get = (c: string) => (row[cols.indexOf(c)] ?? '').trim();
    const numOrNaN = (c: string) => (get(c) === '' ? undefined : Number(get(c).replace(',', '.')));
    const lid = get('lid_on').toLowerCase();
    const candidate = {
      name: unsafeCell(get('name')),
      method: get('method'),
      servingsPerBatch: numOrNaN('servings_per_batch'),
      foodKgPerServing: numOrNaN('food_kg_per_serving'),
      waterKgPerServing: numOrNaN('water_kg_per_serving'),
      foodCpJPerKgK: numOrNaN('food_cp_j_per_kg_k'),
      litresPerServing: numOrNaN('litres_per_serving'),
      minPotTempC: numOrNaN('min_pot_temp_c'),
      holdMin: numOrNaN('hold_min'),
      safeCoreTempC: numOrNaN('safe_core_temp_c'),
      lidOn: lid === '' ? undefined : ['yes', 'true', '1', 'oui'].includes(lid) ? true : ['no', 'false', '0', 'non'].includes(lid) ? false : lid,
      backupStove: get('backup_stove') || undefined,
      notes: cols.includes('notes') ? unsafeCell(get('notes')) || null : null,
    };
    const r = createDishSchema.safeParse(candidate);
    if (!r.success) {
      const fields = zodFields(r.error);
      for (const [k, msg] of Object.entries(fields)) errors.push({ line, field: toCsvColumn(k), message: msg });
      return;
    }
    const key = r.data.name.toLowerCase();
    if (names.has(key)) errors.push({ line, field: 'name', message: `"${r.data.name}" appears twice in the file.` });
    names.add(key);
    dishes.push(r.data);
  });
  return errors.length ? { dishes: [], errors: errors.slice(0, 20) } : { dishes, errors: [] };
}

function toCsvColumn(field: string): string {
  // foodKgPerServing → food_kg_per_serving: the CSV header is the snake-case of the field.
  return field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
}

/** Imports all dishes of a CSV in one transaction; an existing name is updated. Nothing is saved on any error. */
export async function importDishes(viewer: Viewer, organisationId: string, text: string) {
  const { dishes, errors } = parseDishCsv(text);
  if (errors.length) {
    const fields: Record<string, string> = {};
    for (const e of errors) fields[`line ${e.line}.${e.field}`] = e.message;
    throw unprocessable(`The file has ${errors.length}${errors.length === 20 ? '+' : ''} error(s); nothing was imported. First: line ${errors[0]!.line}, ${errors[0]!.field}: ${errors[0]!.message}`, fields);
  }
  let created = 0;
  let updated = 0;
  await viewer.em.transactional(async (tx) => {
    for (const d of dishes) {
      const existing = await tx.findOne(DishSchema, { organisation: organisationId, name: d.name });
      if (existing) {
        tx.assign(existing, { ...d, notes: d.notes ?? null, archived: false });
        updated++;
      } else {
        tx.create(DishSchema, { ...d, notes: d.notes ?? null, organisation: tx.getReference(OrganisationSchema, organisationId), archived: false });
        created++;
      }
    }
    recordAudit(tx, { organisationId, actorId: viewer.user.id, action: 'dish.import', entityType: 'Dish', entityId: 'csv', details: { created, updated } });
  });
  return { created, updated };
}
