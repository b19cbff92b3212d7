/**
 * Backup fuel for batches the sun cannot serve: fuel = useful heat ÷ stove efficiency ÷ net
 * calorific value (kg), or ÷ 3.6 MJ/kWh for electricity; cost from a local price; CO₂ from the
 * IPCC 2006 default factors (fuel energy [TJ] × factor [kg/TJ]), biogenic CO₂ (wood) reported separately.
 * Pure functions; units follow lib/GLOSSARY.md.
 */
import { estimateBatchHeat, type BatchHeatInput, type HeatEstimate, type HeatEstimateOptions } from './energy';
import {
  DEFAULT_GRID_KG_CO2_PER_KWH,
  FUELS,
  J_PER_KWH,
  J_PER_TJ,
  STOVES,
  WOOD_BASELINE_STOVE,
  type FuelId,
  type StoveId,
  type StoveSpec,
} from './factors';

export interface BackupBatchInput extends BatchHeatInput {
  dishName?: string;
  servings?: number;
  /** Serve-by time [epoch ms]; decides the day the fuel is counted on. */
  serveByMs: number;
}

export interface FuelOptions extends HeatEstimateOptions {
  /** Stove to use: a default id or a full spec (e.g. a measured efficiency). Default LPG. */
  stove?: StoveId | StoveSpec;
  /** Local prices per unit of fuel (per kg, or per kWh for electricity), in `currency`. */
  prices?: Partial<Record<FuelId, number>>;
  currency?: string;
  /** Grid CO₂ factor [kg/kWh]; default DEFAULT_GRID_KG_CO2_PER_KWH (from memory). */
  gridKgCo2PerKWh?: number;
  /** IANA time zone for the day totals; default 'UTC'. */
  timeZone?: string;
}

export interface BatchFuel {
  batchId: string;
  dishName?: string;
  stoveId: string;
  fuelId: FuelId;
  heat: HeatEstimate;
  /** Fuel energy burned or drawn [J] = useful ÷ efficiency. */
  fuelEnergyJ: number;
  /** Amount of fuel in its unit (kg, or kWh for electricity). */
  amount: number;
  unit: 'kg' | 'kWh';
  /** Cost in the local currency, or null when no price was given. */
  cost: number | null;
  /** Fossil (counted) CO₂ [kg]. */
  co2Kg: number;
  /** Biogenic CO₂ [kg], reported separately (wood). */
  co2BiogenicKg: number;
}

export interface FuelTotals {
  batches: number;
  usefulJ: number;
  fuelEnergyJ: number;
  /** Amount per fuel in its unit. */
  amountByFuel: Partial<Record<FuelId, number>>;
  /** Cost, or null when any batch had no price. */
  cost: number | null;
  co2Kg: number;
  co2BiogenicKg: number;
}

export interface DayFuel extends FuelTotals {
  /** Local date YYYY-MM-DD in the chosen time zone. */
  day: string;
}

export interface BackupFuelReport {
  stove: StoveSpec;
  currency: string | null;
  perBatch: BatchFuel[];
  perDay: DayFuel[];
  total: FuelTotals;
}

function resolveStove(stove: StoveId | StoveSpec | undefined): StoveSpec {
  if (stove === undefined) return STOVES.lpg;
  if (typeof stove === 'string') {
    const s = STOVES[stove];
    if (!s) throw new RangeError(`stove must be one of ${Object.keys(STOVES).join(', ')}, got ${stove}`);
    return s;
  }
  if (!FUELS[stove.fuelId]) throw new RangeError(`stove.fuelId must be one of ${Object.keys(FUELS).join(', ')}, got ${String(stove.fuelId)}`);
  if (!Number.isFinite(stove.efficiency) || stove.efficiency <= 0 || stove.efficiency > 1) {
    throw new RangeError(`stove.efficiency must be in (0, 1], got ${stove.efficiency}`);
  }
  return stove;
}

/**
 * Fuel, cost and CO₂ for one batch on a backup stove.
 * amount = useful/η/NCV [kg] or useful/η/3.6e6 [kWh]; CO₂ = useful/η/1e12 [TJ] × factor [kg/TJ]
 * (IPCC 2006 Vol. 2 Table 2.5), electricity: kWh × grid factor [kg/kWh].
 */
export function estimateBackupFuel(batch: BackupBatchInput, opts: FuelOptions): BatchFuel {
  const stove = resolveStove(opts.stove);
  const fuel = FUELS[stove.fuelId];
  const heat = estimateBatchHeat(batch, opts);
  const fuelEnergyJ = heat.usefulJ / stove.efficiency;
  let amount: number;
  let co2Kg = 0;
  let co2BiogenicKg = 0;
  if (fuel.unit === 'kWh') {
    amount = fuelEnergyJ / J_PER_KWH;
    const grid = opts.gridKgCo2PerKWh ?? DEFAULT_GRID_KG_CO2_PER_KWH;
    if (!Number.isFinite(grid) || grid < 0) throw new RangeError(`gridKgCo2PerKWh must be ≥ 0, got ${grid}`);
    co2Kg = amount * grid;
  } else {
    amount = fuelEnergyJ / (fuel.ncvJPerKg as number);
    const co2 = (fuelEnergyJ / J_PER_TJ) * (fuel.co2KgPerTJ as number);
    if (fuel.biogenic) co2BiogenicKg = co2;
    else co2Kg = co2;
  }
  const price = opts.prices?.[fuel.id];
  if (price !== undefined && (!Number.isFinite(price) || price < 0)) throw new RangeError(`prices.${fuel.id} must be ≥ 0, got ${price}`);
  return {
    batchId: batch.id,
    ...(batch.dishName !== undefined ? { dishName: batch.dishName } : {}),
    stoveId: stove.id,
    fuelId: fuel.id,
    heat,
    fuelEnergyJ,
    amount,
    unit: fuel.unit,
    cost: price === undefined ? null : amount * price,
    co2Kg,
    co2BiogenicKg,
  };
}

function emptyTotals(): FuelTotals {
  return { batches: 0, usefulJ: 0, fuelEnergyJ: 0, amountByFuel: {}, cost: 0, co2Kg: 0, co2BiogenicKg: 0 };
}

function addTo(t: FuelTotals, b: BatchFuel): void {
  t.batches += 1;
  t.usefulJ += b.heat.usefulJ;
  t.fuelEnergyJ += b.fuelEnergyJ;
  t.amountByFuel[b.fuelId] = (t.amountByFuel[b.fuelId] ?? 0) + b.amount;
  t.cost = t.cost === null || b.cost === null ? null : t.cost + b.cost;
  t.co2Kg += b.co2Kg;
  t.co2BiogenicKg += b.co2BiogenicKg;
}

function dayKey(ms: number, fmt: Intl.DateTimeFormat): string {
  const parts = fmt.formatToParts(new Date(ms));
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}

/**
 * Backup fuel for a list of batches: per batch, per local day (by serve-by) and in total.
 * Batches keep their input order; days are sorted.
 */
export function planBackupFuel(batches: readonly BackupBatchInput[], opts: FuelOptions): BackupFuelReport {
  const stove = resolveStove(opts.stove);
  let fmt: Intl.DateTimeFormat;
  try {
    fmt = new Intl.DateTimeFormat('en-CA', { timeZone: opts.timeZone ?? 'UTC', year: 'numeric', month: '2-digit', day: '2-digit' });
  } catch {
    throw new RangeError(`timeZone must be an IANA time zone, got ${String(opts.timeZone)}`);
  }
  const perBatch = batches.map((b) => {
    if (!Number.isFinite(b.serveByMs)) throw new RangeError(`batch ${b.id}: serveByMs must be an instant [epoch ms]`);
    return estimateBackupFuel(b, { ...opts, stove });
  });
  const total = emptyTotals();
  const days = new Map<string, DayFuel>();
  perBatch.forEach((bf, i) => {
    addTo(total, bf);
    const key = dayKey((batches[i] as BackupBatchInput).serveByMs, fmt);
    let d = days.get(key);
    if (!d) {
      d = { day: key, ...emptyTotals() };
      days.set(key, d);
    }
    addTo(d, bf);
  });
  if (perBatch.length === 0) total.cost = opts.prices?.[stove.fuelId] === undefined ? null : 0;
  const perDay = [...days.values()].sort((a, b) => (a.day < b.day ? -1 : a.day > b.day ? 1 : 0));
  return { stove, currency: opts.currency ?? null, perBatch, perDay, total };
}

export interface WoodComparison {
  /** Every batch of the menu cooked on the baseline wood stove. */
  allOnWood: FuelTotals;
  /** Only the backup batches, on the chosen backup stove. */
  plan: FuelTotals;
  /** Wood not burned thanks to the sun [kg]: wood for the batches served by the sun. */
  woodAvoidedKg: number;
  /** Fossil CO₂ of the plan's backup fuel [kg] and the biogenic CO₂ avoided by not burning wood [kg]. */
  planCo2Kg: number;
  biogenicCo2AvoidedKg: number;
  /** Share of the all-wood useful heat the sun provides [0..1]. */
  solarShareOfHeat: number;
}

/**
 * The coordinator's comparison: the whole menu on a three-stone wood fire versus the plan
 * (sun for the placed batches, the chosen backup stove for the rest).
 * @param all every batch of the day(s)
 * @param backupIds ids of the batches that go to the backup stove
 */
export function compareWithAllOnWood(
  all: readonly BackupBatchInput[],
  backupIds: ReadonlySet<string> | readonly string[],
  opts: FuelOptions & { woodStove?: StoveId | StoveSpec },
): WoodComparison {
  const ids = backupIds instanceof Set ? backupIds : new Set(backupIds as readonly string[]);
  const woodOpts: FuelOptions = { ...opts, stove: opts.woodStove ?? WOOD_BASELINE_STOVE };
  const wood = planBackupFuel(all, woodOpts);
  const plan = planBackupFuel(
    all.filter((b) => ids.has(b.id)),
    opts,
  );
  let woodAvoidedKg = 0;
  let biogenicAvoided = 0;
  let solarUseful = 0;
  wood.perBatch.forEach((bf) => {
    if (!ids.has(bf.batchId)) {
      woodAvoidedKg += bf.amount;
      biogenicAvoided += bf.co2BiogenicKg;
      solarUseful += bf.heat.usefulJ;
    }
  });
  return {
    allOnWood: wood.total,
    plan: plan.total,
    woodAvoidedKg,
    planCo2Kg: plan.total.co2Kg,
    biogenicCo2AvoidedKg: biogenicAvoided,
    solarShareOfHeat: wood.total.usefulJ > 0 ? solarUseful / wood.total.usefulJ : 0,
  };
}
