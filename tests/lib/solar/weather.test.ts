import { describe, expect, it } from 'vitest';
import { DEFAULT_LINKE_TURBIDITY_MONTHLY } from '@/lib/solar/clearsky';
import { solarPositionSpa } from '@/lib/solar/position';
import {
  clearSkyHourly,
  dailyAirTemperatureC,
  resolveWeatherDetailed,
  resolveWeatherToAperture,
  type ApertureGeometry,
  type HourlyWeather,
  type Site,
} from '@/lib/solar/weather';

const D = Math.PI / 180;
const HOUR = 3_600_000;
const DAY0 = Date.UTC(2024, 2, 20); // March equinox, UTC midnight
const SITE: Site = { latitudeDeg: 15, longitudeDeg: 0, altitudeM: 300 };
const BOX: ApertureGeometry = { tracking: 'fixed', tiltDeg: 15, surfaceAzimuthDeg: 180, beamOnly: false };
const DISH: ApertureGeometry = { tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 180, beamOnly: true };

// Independent restatements of the published formulas.
// Erbs, Klein & Duffie 1982, Solar Energy 28(4):293–302, eq. 1.
const erbs = (kt: number) =>
  kt <= 0.22 ? 1 - 0.09 * kt : kt <= 0.8 ? 0.9511 - 0.1604 * kt + 4.388 * kt ** 2 - 16.638 * kt ** 3 + 12.336 * kt ** 4 : 0.165;
// Ineichen & Perez 2002, Solar Energy 73(3):151–157, with Kasten & Young 1989 air mass.
const ipGhi = (z: number, h: number, tl: number, i0: number) => {
  const am = 1 / (Math.cos(z * D) + 0.50572 * (96.07995 - z) ** -1.6364);
  return (5.09e-5 * h + 0.868) * i0 * Math.cos(z * D) * Math.exp(-(3.92e-5 * h + 0.0387) * am * (Math.exp(-h / 8000) + Math.exp(-h / 1250) * (tl - 1)));
};
// Kasten & Czeplak 1980, Solar Energy 24:177–189.
const kc = (n: number) => 1 - 0.75 * (n / 8) ** 3.4;

function hours(n: number, f: (i: number, t: number) => Omit<HourlyWeather, 't'>): HourlyWeather[] {
  return Array.from({ length: n }, (_, i) => ({ t: DAY0 + i * HOUR, ...f(i, DAY0 + i * HOUR) }));
}

describe('resolveWeatherToAperture — steps', () => {
  const clear = clearSkyHourly(SITE, DAY0, DAY0 + 24 * HOUR);

  it('steps are contiguous, equally spaced and cover the hours given', () => {
    for (const stepS of [60, 300, 900, 3600]) {
      const steps = resolveWeatherToAperture(SITE, BOX, clear, stepS);
      expect(steps.length).toBe((24 * 3600) / stepS);
      steps.forEach((s, i) => expect(s.t).toBe(DAY0 + i * stepS * 1000));
    }
    // A step that does not divide the span: the last step runs past the end (ceil).
    const odd = resolveWeatherToAperture(SITE, BOX, clear.slice(0, 2), 7);
    expect(odd.length).toBe(Math.ceil(7200 / 7));
    expect((odd.at(-1)?.t ?? 0) + 7000).toBeGreaterThanOrEqual(DAY0 + 2 * HOUR);
  });

  it('is exactly zero at night and positive at midday', () => {
    const r = resolveWeatherDetailed(SITE, BOX, clear, 60);
    let night = 0;
    r.steps.forEach((s, i) => {
      if ((r.zenithDeg[i] ?? 0) >= 90) {
        night++;
        expect(s.gApertureWm2).toBe(0);
        expect(r.ghiWm2[i]).toBe(0);
      }
    });
    expect(night).toBeGreaterThan(600);
    expect(r.steps[12 * 60]?.gApertureWm2 ?? 0).toBeGreaterThan(800);
  });

  it('DNI + DHI path: components close (GHI = DHI + DNI·cos z) and daily energy is kept within 2 %', () => {
    const r = resolveWeatherDetailed(SITE, BOX, clear, 60);
    expect(r.hourSource.every((s) => s === 'beam-diffuse')).toBe(true);
    for (let i = 0; i < r.steps.length; i++) {
      const z = r.zenithDeg[i] ?? 90;
      if (z >= 90) continue;
      expect(Math.abs((r.dhiWm2[i] ?? 0) + (r.dniWm2[i] ?? 0) * Math.cos(z * D) - (r.ghiWm2[i] ?? 0))).toBeLessThan(1e-9);
    }
    const stepSum = r.ghiWm2.reduce((a, b) => a + b, 0) * 60;
    const hourSum = clear.reduce((a, h) => a + (h.ghiWm2 ?? 0), 0) * 3600;
    // Tolerance: interpolation of hourly indices is not exactly energy-preserving (common practice, no source).
    expect(Math.abs(stepSum / hourSum - 1)).toBeLessThan(0.02);
    // The beam keeps its daily total too (it is spread within each hour like the clear-sky beam).
    const dniSteps = r.dniWm2.reduce((a, b) => a + b, 0) * 60;
    const dniHours = clear.reduce((a, h) => a + (h.dniWm2 ?? 0), 0) * 3600;
    expect(Math.abs(dniSteps / dniHours - 1)).toBeLessThan(0.02);
  });

  it('GHI-only path: each step follows Erbs 1982 and the clearness index of the hour', () => {
    const kt = 0.62;
    // Hourly GHI = kt × hourly mean of I0·cos z, integrated here by the full SPA at 1-minute resolution.
    const input = hours(24, (_, t) => {
      let s = 0;
      for (let m = 0; m < 60; m++) {
        const p = solarPositionSpa({ timeMs: t + (m + 0.5) * 60_000, ...SITE });
        s += Math.max(0, Math.cos(p.zenithNoRefractionDeg * D)) * (1361 / p.earthSunDistanceAu ** 2);
      }
      return { ghiWm2: (kt * s) / 60, tAirC: 25 };
    });
    const r = resolveWeatherDetailed(SITE, BOX, input, 60);
    expect(r.hourSource.every((s) => s === 'global')).toBe(true);
    let checked = 0;
    for (let i = 0; i < r.steps.length; i++) {
      const z = r.zenithDeg[i] ?? 90;
      const ghi = r.ghiWm2[i] ?? 0;
      if (z >= 85) continue;
      const i0 = r.i0Wm2[i] ?? 0;
      const ktStep = ghi / (i0 * Math.cos(z * D));
      // Away from sunrise/sunset the step's clearness is the hour's (hour-mean vs. step geometry: 0.5 %).
      if (z < 75) expect(Math.abs(ktStep - kt)).toBeLessThan(0.005);
      expect(Math.abs((r.dhiWm2[i] ?? 0) - erbs(ktStep) * ghi)).toBeLessThan(1e-6);
      expect(Math.abs((r.dniWm2[i] ?? 0) - (ghi - erbs(ktStep) * ghi) / Math.cos(z * D))).toBeLessThan(1e-6);
      checked++;
    }
    expect(checked).toBeGreaterThan(500);
  });

  it('cloud-only path: Ineichen–Perez clear sky × Kasten–Czeplak, then Erbs', () => {
    const okta = 5;
    const input = hours(24, () => ({ cloudOkta: okta, tAirC: 25 }));
    const r = resolveWeatherDetailed(SITE, BOX, input, 60);
    expect(r.hourSource.every((s) => s === 'cloud')).toBe(true);
    const tl = DEFAULT_LINKE_TURBIDITY_MONTHLY[2] ?? NaN; // March, northern hemisphere
    let checked = 0;
    for (let i = 0; i < r.steps.length; i++) {
      const z = r.zenithDeg[i] ?? 90;
      if (z >= 87) continue;
      const i0 = r.i0Wm2[i] ?? 0;
      const ghi = ipGhi(z, SITE.altitudeM, tl, i0) * kc(okta);
      expect(Math.abs((r.ghiWm2[i] ?? 0) - ghi)).toBeLessThan(1e-6);
      const kt = ghi / (i0 * Math.max(0.065, Math.cos(z * D)));
      expect(Math.abs((r.dhiWm2[i] ?? 0) - erbs(kt) * ghi)).toBeLessThan(1e-6);
      checked++;
    }
    expect(checked).toBeGreaterThan(600);
    // A site's own Linke turbidity is used.
    const hazy = resolveWeatherDetailed({ ...SITE, linkeTurbidity: Array<number>(12).fill(6) }, BOX, input, 60);
    const i = 12 * 60;
    expect(Math.abs((hazy.ghiWm2[i] ?? 0) - ipGhi(hazy.zenithDeg[i] ?? 0, 300, 6, hazy.i0Wm2[i] ?? 0) * kc(okta))).toBeLessThan(1e-6);
  });

  it('mixed drivers blend smoothly, and okta interpolates between hours', () => {
    const input = hours(24, (i) => (i < 12 ? { cloudOkta: 2, tAirC: 25 } : { cloudOkta: 6, tAirC: 25 }));
    const r = resolveWeatherDetailed(SITE, BOX, input, 60);
    const at = (h: number, m: number) => r.ghiWm2[h * 60 + m] ?? NaN;
    // Step 12:00 has its mid at 12:00:30, between the centres 11:30 (2 okta) and 12:30 (6 okta): okta is interpolated.
    const i = 12 * 60;
    const z = r.zenithDeg[i] ?? 0;
    const okta = 2 + 4 * (((r.midMs[i] ?? 0) - (DAY0 + 11.5 * HOUR)) / HOUR);
    expect(Math.abs(okta - (4 + 2 / 60))).toBeLessThan(1e-9);
    expect(Math.abs(at(12, 0) - ipGhi(z, 300, DEFAULT_LINKE_TURBIDITY_MONTHLY[2] ?? NaN, r.i0Wm2[i] ?? 0) * kc(okta))).toBeLessThan(1e-6);
    expect(at(11, 0)).toBeGreaterThan(at(13, 0));
    const mixed = hours(24, (i2, t) => (i2 % 2 ? { cloudOkta: 0, tAirC: 25 } : { ghiWm2: (clear.find((c) => c.t === t)?.ghiWm2 ?? 0) * 0.9, tAirC: 25 }));
    const rm = resolveWeatherDetailed(SITE, BOX, mixed, 60);
    expect(new Set(rm.hourSource)).toEqual(new Set(['cloud', 'global']));
    for (let k = 1; k < rm.ghiWm2.length; k++) expect(Math.abs((rm.ghiWm2[k] ?? 0) - (rm.ghiWm2[k - 1] ?? 0))).toBeLessThan(60);
  });

  it('interpolates air temperature and wind linearly between hour centres', () => {
    const input = hours(3, (i) => ({ cloudOkta: 0, tAirC: 10 + 10 * i, windMS: i === 1 ? 4 : 2 }));
    const steps = resolveWeatherToAperture(SITE, BOX, input, 60);
    // Step 29 has its midpoint at 00:29:30 — before the first centre: held at 10 °C.
    expect(steps[0]?.tAirC).toBe(10);
    // Step starting 01:00 has its mid at 01:00:30: between centres 00:30 (10 °C) and 01:30 (20 °C).
    expect(Math.abs((steps[60]?.tAirC ?? NaN) - (10 + 10 * (30.5 / 60)))).toBeLessThan(1e-9);
    expect(Math.abs((steps[60]?.windMS ?? NaN) - (2 + 2 * (30.5 / 60)))).toBeLessThan(1e-9);
    expect(steps.at(-1)?.tAirC).toBe(30);
    const noWind = resolveWeatherToAperture(SITE, BOX, hours(2, () => ({ cloudOkta: 0, tAirC: 20 })), 600);
    expect(noWind[0]?.windMS).toBeUndefined();
  });

  it('tracking concentrators collect at least as much beam as fixed ones; box cookers add diffuse', () => {
    const day = (g: ApertureGeometry) => resolveWeatherToAperture(SITE, g, clear, 60).reduce((a, s) => a + s.gApertureWm2, 0);
    const fixedBeam = day({ ...BOX, beamOnly: true });
    const oneAxis = day({ ...DISH, tracking: 'one-axis' });
    const twoAxis = day(DISH);
    expect(twoAxis).toBeGreaterThanOrEqual(oneAxis);
    expect(oneAxis).toBeGreaterThanOrEqual(fixedBeam);
    expect(day(BOX)).toBeGreaterThan(fixedBeam);
  });

  it('the NOAA sun gives the same day within 0.5 %', () => {
    const spa = resolveWeatherToAperture(SITE, BOX, clear, 60).reduce((a, s) => a + s.gApertureWm2, 0);
    const noaa = resolveWeatherToAperture(SITE, BOX, clear, 60, { solarModel: 'noaa' }).reduce((a, s) => a + s.gApertureWm2, 0);
    expect(Math.abs(noaa / spa - 1)).toBeLessThan(0.005);
  });
});

describe('resolveWeatherToAperture — bad inputs throw RangeError naming the argument', () => {
  const ok = hours(3, () => ({ ghiWm2: 100, tAirC: 20 }));
  const cases: [string, () => unknown, RegExp][] = [
    ['latitude', () => resolveWeatherToAperture({ ...SITE, latitudeDeg: 91 }, BOX, ok, 60), /site\.latitudeDeg/],
    ['longitude NaN', () => resolveWeatherToAperture({ ...SITE, longitudeDeg: NaN }, BOX, ok, 60), /site\.longitudeDeg/],
    ['turbidity', () => resolveWeatherToAperture({ ...SITE, linkeTurbidity: [3, 3] }, BOX, ok, 60), /site\.linkeTurbidity/],
    ['tracking', () => resolveWeatherToAperture(SITE, { ...BOX, tracking: 'three-axis' as 'fixed' }, ok, 60), /geometry\.tracking.*'fixed', 'one-axis', 'two-axis'/],
    ['tilt', () => resolveWeatherToAperture(SITE, { ...BOX, tiltDeg: -5 }, ok, 60), /geometry\.tiltDeg/],
    ['albedo', () => resolveWeatherToAperture(SITE, { ...BOX, groundAlbedo: 1.5 }, ok, 60), /geometry\.groundAlbedo/],
    ['empty', () => resolveWeatherToAperture(SITE, BOX, [], 60), /hourly/],
    ['unsorted', () => resolveWeatherToAperture(SITE, BOX, [ok[1], ok[0]] as HourlyWeather[], 60), /hourly\[1\]\.t.*sorted/],
    ['gap', () => resolveWeatherToAperture(SITE, BOX, [ok[0], ok[2]] as HourlyWeather[], 60), /hourly\[1\]\.t.*gap/],
    ['negative ghi', () => resolveWeatherToAperture(SITE, BOX, [{ ...ok[0], ghiWm2: -1 } as HourlyWeather], 60), /hourly\[0\]\.ghiWm2/],
    ['okta', () => resolveWeatherToAperture(SITE, BOX, [{ t: DAY0, cloudOkta: 9, tAirC: 20 }], 60), /hourly\[0\]\.cloudOkta/],
    ['tAir NaN', () => resolveWeatherToAperture(SITE, BOX, [{ t: DAY0, ghiWm2: 0, tAirC: NaN }], 60), /hourly\[0\]\.tAirC/],
    ['no irradiance', () => resolveWeatherToAperture(SITE, BOX, [{ t: DAY0, dniWm2: 5, tAirC: 20 }], 60), /hourly\[0\] needs/],
    ['stepS 0', () => resolveWeatherToAperture(SITE, BOX, ok, 0), /stepS/],
    ['stepS negative', () => resolveWeatherToAperture(SITE, BOX, ok, -60), /stepS/],
    ['stepS NaN', () => resolveWeatherToAperture(SITE, BOX, ok, NaN), /stepS/],
    ['model', () => resolveWeatherToAperture(SITE, BOX, ok, 60, { solarModel: 'psa' as 'spa' }), /opts\.solarModel.*'spa', 'noaa'/],
  ];
  for (const [name, f, re] of cases) {
    it(name, () => {
      expect(f).toThrow(RangeError);
      expect(f).toThrow(re);
    });
  }
});

describe('clearSkyHourly', () => {
  it('makes consecutive hours from the hour containing fromMs, zero at night', () => {
    const h = clearSkyHourly(SITE, DAY0 + 20 * 60_000, DAY0 + 48 * HOUR);
    expect(h.length).toBe(48);
    expect(h[0]?.t).toBe(DAY0);
    h.forEach((x, i) => expect(x.t).toBe(DAY0 + i * HOUR));
    expect(h[0]?.ghiWm2).toBe(0); // 00:00–01:00 UTC at 0° E
    expect(h[12]?.ghiWm2 ?? 0).toBeGreaterThan(900);
  });

  it('hour means follow the Ineichen–Perez clear sky and a clearness factor scales GHI', () => {
    const full = clearSkyHourly(SITE, DAY0, DAY0 + 24 * HOUR);
    const half = clearSkyHourly(SITE, DAY0, DAY0 + 24 * HOUR, { clearness: 0.5 });
    for (let i = 0; i < 24; i++) {
      expect(Math.abs((half[i]?.ghiWm2 ?? 0) - 0.5 * (full[i]?.ghiWm2 ?? 0))).toBeLessThan(1e-9);
    }
    // Noon hour mean vs an independent evaluation at the 12 five-minute midpoints.
    const tl = DEFAULT_LINKE_TURBIDITY_MONTHLY[2] ?? NaN;
    let s = 0;
    for (let j = 0; j < 12; j++) {
      const p = solarPositionSpa({ timeMs: DAY0 + 12 * HOUR + (j + 0.5) * 300_000, ...SITE });
      s += ipGhi(p.zenithDeg, 300, tl, 1361 / p.earthSunDistanceAu ** 2);
    }
    expect(Math.abs((full[12]?.ghiWm2 ?? 0) - s / 12)).toBeLessThan(0.01);
  });

  it('has a plausible daily temperature cycle: minimum near 06:00, maximum near 15:00 solar time', () => {
    const h = clearSkyHourly({ ...SITE, longitudeDeg: 0 }, DAY0, DAY0 + 24 * HOUR, { tAirC: { minC: 12, maxC: 31 } });
    const temps = h.map((x) => x.tAirC);
    const iMin = temps.indexOf(Math.min(...temps));
    const iMax = temps.indexOf(Math.max(...temps));
    expect(Math.abs(iMin + 0.5 - 6)).toBeLessThanOrEqual(1);
    expect(Math.abs(iMax + 0.5 - 15)).toBeLessThanOrEqual(1);
    expect(Math.min(...temps)).toBeGreaterThanOrEqual(12);
    expect(Math.max(...temps)).toBeLessThanOrEqual(31);
    // The shape itself: exact extremes at 06:00 and 15:00 (common practice, no source).
    expect(dailyAirTemperatureC(6, 12, 31)).toBeCloseTo(12, 12);
    expect(dailyAirTemperatureC(15, 12, 31)).toBeCloseTo(31, 12);
    expect(dailyAirTemperatureC(30, 12, 31)).toBeCloseTo(12, 12);
  });

  it('feeds resolveWeatherToAperture end to end (the fallback when no forecast exists)', () => {
    const steps = resolveWeatherToAperture(SITE, DISH, clearSkyHourly(SITE, DAY0, DAY0 + 24 * HOUR, { windMS: 1.5 }), 60);
    expect(steps.length).toBe(1440);
    expect(steps.every((s) => s.windMS === 1.5 && s.gApertureWm2 >= 0)).toBe(true);
    // A two-axis dish at 15° N on a clear equinox day collects 6–10 kWh/m² of beam (common practice, no source).
    const kWh = steps.reduce((a, s) => a + s.gApertureWm2 * 60, 0) / 3.6e6;
    expect(kWh).toBeGreaterThan(6);
    expect(kWh).toBeLessThan(10);
  });

  it('bad inputs throw RangeError naming the argument', () => {
    expect(() => clearSkyHourly(SITE, DAY0, DAY0)).toThrow(/toMs/);
    expect(() => clearSkyHourly(SITE, NaN, DAY0)).toThrow(/fromMs/);
    expect(() => clearSkyHourly(SITE, DAY0, DAY0 + HOUR, { clearness: 1.5 })).toThrow(/opts\.clearness/);
    expect(() => clearSkyHourly(SITE, DAY0, DAY0 + HOUR, { tAirC: { minC: 30, maxC: 20 } })).toThrow(/opts\.tAirC\.maxC/);
    expect(() => clearSkyHourly({ ...SITE, altitudeM: NaN }, DAY0, DAY0 + HOUR)).toThrow(/site\.altitudeM/);
    expect(() => clearSkyHourly(SITE, DAY0, DAY0 + 1e6 * HOUR)).toThrow(/toMs/);
  });
});
