import { describe, expect, it } from 'vitest';
import {
  boilingPointAtAltitude,
  compareWithAllOnWood,
  efficiencyTierIso19867,
  estimateBackupFuel,
  estimateBatchHeat,
  FUELS,
  planBackupFuel,
  pressureIsa,
  STOVES,
  type BackupBatchInput,
} from '@/lib/fuel';

// A bake batch that never reaches boiling, so only the sensible heat counts (hand calculation below).
const bake: BackupBatchInput = {
  id: 'b1',
  dishName: 'Bean bake',
  method: 'bake',
  potVolumeNeededL: 20,
  foodKg: 5,
  foodCpJPerKgK: 3500,
  waterKg: 2,
  minTempC: 75,
  holdS: 0,
  lidOn: true,
  serveByMs: Date.UTC(2024, 2, 1, 10, 0),
};
const base = { ambientC: 25, altitudeM: 0, potMassKg: 1, potCpJPerKgK: 900 };
// (5·3500 + 1·900)·(75 − 25) + 2·4186·(75 − 25) = 920 000 + 418 600 J
const HEAT_J = 1_338_600;

describe('boiling point', () => {
  it('ISA pressure at sea level and at 1500 m (ISO 2533 standard atmosphere)', () => {
    expect(pressureIsa(0)).toBeCloseTo(101325, 6);
    // ISO 2533 table: 84 556 Pa at 1500 m (secondary)
    expect(Math.abs(pressureIsa(1500) - 84556)).toBeLessThan(20);
  });
  it('≈ 100 °C at sea level and ≈ 95.0 °C at 1500 m (steam tables via ISA pressure, ±0.3 °C)', () => {
    expect(Math.abs(boilingPointAtAltitude(0) - 100)).toBeLessThan(0.1);
    // steam tables: Tsat(84.6 kPa) ≈ 95.0–95.1 °C (secondary)
    expect(Math.abs(boilingPointAtAltitude(1500) - 95.05)).toBeLessThan(0.3);
    // about 1 °C per 300 m (lib/REFERENCES.md, secondary)
    const slopeKPer300m = ((boilingPointAtAltitude(0) - boilingPointAtAltitude(3000)) / 3000) * 300;
    expect(slopeKPer300m).toBeGreaterThan(0.9);
    expect(slopeKPer300m).toBeLessThan(1.1);
  });
});

describe('useful heat of a batch', () => {
  it('sensible heat of food, water and pot from ambient to the dish temperature', () => {
    const h = estimateBatchHeat(bake, base);
    expect(h.targetTempC).toBe(75);
    expect(h.heatingJ).toBeCloseTo(HEAT_J, 3);
    expect(h.holdingJ).toBe(0);
    expect(h.evaporationJ).toBe(0);
    expect(h.usefulJ).toBeCloseTo(HEAT_J, 3);
  });

  it('holding losses of a 20 L cylinder (H = D), 10 W/(m²·K) with lid, doubled without', () => {
    const d = Math.cbrt((4 * 0.02) / Math.PI); // 0.2942 m
    const area = Math.PI * d * d * 1.25; // wall π·D·H + lid π·D²/4 with H = D
    const withLid = estimateBatchHeat({ ...bake, holdS: 3600 }, base);
    expect(withLid.potUaWPerK).toBeCloseTo(10 * area, 9);
    expect(withLid.holdingJ).toBeCloseTo(10 * area * 50 * 3600, 3); // ≈ 611 800 J
    const lidOff = estimateBatchHeat({ ...bake, holdS: 3600, lidOn: false }, base);
    expect(lidOff.holdingJ / withLid.holdingJ).toBeCloseTo(2, 12);
  });

  it('boiling: contents to the boiling point and boil-off 0.15 of the water per hour lid off', () => {
    const boil: BackupBatchInput = { ...bake, method: 'boil', foodKg: 0, waterKg: 10, holdS: 1800, lidOn: false };
    const h = estimateBatchHeat(boil, { ...base, potMassKg: 0 });
    const tb = boilingPointAtAltitude(0);
    expect(h.targetTempC).toBe(tb);
    expect(h.heatingJ).toBeCloseTo(10 * 4186 * (tb - 25), 3);
    expect(h.evaporatedKg).toBeCloseTo(0.75, 12); // 10 kg × 0.15/h × 0.5 h
    expect(h.evaporationJ).toBeCloseTo(0.75 * 2.257e6, 3); // steam tables, 2257 kJ/kg
  });

  it('frying above the boiling point drives all the water off and caps its sensible heat at boiling', () => {
    const fry: BackupBatchInput = { ...bake, method: 'fry', minTempC: 160 };
    const h = estimateBatchHeat(fry, base);
    const tb = boilingPointAtAltitude(0);
    expect(h.heatingJ).toBeCloseTo((5 * 3500 + 900) * 135 + 2 * 4186 * (tb - 25), 3);
    expect(h.evaporatedKg).toBe(2);
  });
});

describe('fuel, cost and CO₂ (IPCC 2006 Vol. 2 Table 1.2 NCV, Table 2.5 CO₂ factors)', () => {
  it('LPG at 55 %: 47.3 MJ/kg, 63 100 kg CO₂/TJ', () => {
    const r = estimateBackupFuel(bake, { ...base, stove: 'lpg', prices: { lpg: 1.5 } });
    const fuelJ = HEAT_J / 0.55; // 2 433 818 J
    expect(r.fuelEnergyJ).toBeCloseTo(fuelJ, 3);
    expect(r.amount).toBeCloseTo(fuelJ / 47.3e6, 9); // 0.05146 kg
    expect(r.unit).toBe('kg');
    expect(r.cost).toBeCloseTo((fuelJ / 47.3e6) * 1.5, 9);
    expect(r.co2Kg).toBeCloseTo((fuelJ / 1e12) * 63_100, 9); // 0.1536 kg
    expect(r.co2BiogenicKg).toBe(0);
  });

  it('three-stone wood fire at 15 %: 15.6 MJ/kg, 112 000 kg/TJ reported as biogenic', () => {
    const r = estimateBackupFuel(bake, { ...base, stove: 'three-stone-wood' });
    const fuelJ = HEAT_J / 0.15; // 8 924 000 J
    expect(r.amount).toBeCloseTo(fuelJ / 15.6e6, 9); // 0.5721 kg
    expect(r.co2BiogenicKg).toBeCloseTo((fuelJ / 1e12) * 112_000, 9); // 0.9995 kg
    expect(r.co2Kg).toBe(0);
    expect(r.cost).toBeNull();
  });

  it('kerosene 43.8 MJ/kg and 71 900 kg/TJ; charcoal 29.5 MJ/kg and 112 000 kg/TJ (from memory)', () => {
    const k = estimateBackupFuel(bake, { ...base, stove: 'kerosene-pressure' });
    expect(k.amount).toBeCloseTo(HEAT_J / 0.45 / 43.8e6, 9);
    expect(k.co2Kg).toBeCloseTo((HEAT_J / 0.45 / 1e12) * 71_900, 9);
    const c = estimateBackupFuel(bake, { ...base, stove: 'charcoal' });
    expect(c.amount).toBeCloseTo(HEAT_J / 0.25 / 29.5e6, 9);
    expect(c.co2Kg).toBeCloseTo((HEAT_J / 0.25 / 1e12) * 112_000, 9);
  });

  it('electric hotplate at 70 %: kWh and a grid factor', () => {
    const r = estimateBackupFuel(bake, { ...base, stove: 'electric-hotplate', gridKgCo2PerKWh: 0.8, prices: { electricity: 0.2 } });
    const kWh = HEAT_J / 0.7 / 3.6e6; // 0.5312 kWh
    expect(r.unit).toBe('kWh');
    expect(r.amount).toBeCloseTo(kWh, 12);
    expect(r.co2Kg).toBeCloseTo(kWh * 0.8, 12);
    expect(r.cost).toBeCloseTo(kWh * 0.2, 12);
  });

  it('factor tables hold the IPCC values', () => {
    expect(FUELS.lpg.ncvJPerKg).toBe(47.3e6);
    expect(FUELS.kerosene.ncvJPerKg).toBe(43.8e6);
    expect(FUELS.wood.ncvJPerKg).toBe(15.6e6);
    expect(FUELS.charcoal.ncvJPerKg).toBe(29.5e6);
    expect(FUELS.lpg.co2KgPerTJ).toBe(63_100);
    expect(FUELS.kerosene.co2KgPerTJ).toBe(71_900);
    expect(FUELS.wood.co2KgPerTJ).toBe(112_000);
    expect(FUELS.wood.biogenic).toBe(true);
  });
});

describe('ISO/TR 19867-3:2018 efficiency tiers', () => {
  it('thresholds 10/20/30/40/50 %', () => {
    expect([0.05, 0.1, 0.15, 0.2, 0.3, 0.4, 0.49, 0.5, 0.7].map(efficiencyTierIso19867)).toEqual([0, 1, 1, 2, 3, 4, 4, 5, 5]);
    expect(STOVES['three-stone-wood'].tier).toBe(1);
    expect(STOVES.lpg.tier).toBe(5);
  });
});

describe('day totals and the all-on-wood comparison', () => {
  const second: BackupBatchInput = { ...bake, id: 'b2', serveByMs: Date.UTC(2024, 2, 1, 22, 30) }; // 01:30 on 2 March in Nairobi (UTC+3)
  it('groups by local day of serve-by', () => {
    const r = planBackupFuel([bake, second], { ...base, stove: 'lpg', timeZone: 'Africa/Nairobi', prices: { lpg: 2 } });
    expect(r.perDay.map((d) => d.day)).toEqual(['2024-03-01', '2024-03-02']);
    expect(r.perDay[0]?.amountByFuel.lpg).toBeCloseTo(HEAT_J / 0.55 / 47.3e6, 9);
    expect(r.total.amountByFuel.lpg).toBeCloseTo((2 * HEAT_J) / 0.55 / 47.3e6, 9);
    expect(r.total.cost).toBeCloseTo(((2 * HEAT_J) / 0.55 / 47.3e6) * 2, 9);
    const utc = planBackupFuel([bake, second], { ...base, stove: 'lpg' });
    expect(utc.perDay.map((d) => d.day)).toEqual(['2024-03-01']);
  });

  it('all on wood vs the plan: wood avoided equals the wood of the sun-served batches', () => {
    const c = compareWithAllOnWood([bake, second], ['b2'], { ...base, stove: 'lpg' });
    expect(c.allOnWood.amountByFuel.wood).toBeCloseTo((2 * HEAT_J) / 0.15 / 15.6e6, 9);
    expect(c.woodAvoidedKg).toBeCloseTo(HEAT_J / 0.15 / 15.6e6, 9);
    expect(c.plan.amountByFuel.lpg).toBeCloseTo(HEAT_J / 0.55 / 47.3e6, 9);
    expect(c.planCo2Kg).toBeCloseTo((HEAT_J / 0.55 / 1e12) * 63_100, 9);
    expect(c.solarShareOfHeat).toBeCloseTo(0.5, 12);
  });
});

describe('bad inputs name the field', () => {
  it('rejects negative masses, unknown stoves, bad efficiency, bad time zone', () => {
    expect(() => estimateBatchHeat({ ...bake, foodKg: -1 }, base)).toThrow(/foodKg/);
    expect(() => estimateBatchHeat({ ...bake, holdS: Number.NaN }, base)).toThrow(/holdS/);
    expect(() => estimateBatchHeat(bake, { ...base, ambientC: Number.NaN })).toThrow(/ambientC/);
    expect(() => estimateBatchHeat({ ...bake, method: 'roast' as never }, base)).toThrow(/method/);
    expect(() => estimateBackupFuel(bake, { ...base, stove: 'rocket' as never })).toThrow(/stove/);
    expect(() => estimateBackupFuel(bake, { ...base, stove: { ...STOVES.lpg, efficiency: 0 } })).toThrow(/efficiency/);
    expect(() => estimateBackupFuel(bake, { ...base, prices: { lpg: -1 } })).toThrow(/prices\.lpg/);
    expect(() => planBackupFuel([bake], { ...base, timeZone: 'Mars/Olympus' })).toThrow(/timeZone/);
    expect(() => efficiencyTierIso19867(1.5)).toThrow(/efficiency/);
  });
});
