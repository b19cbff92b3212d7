import { describe, expect, it } from 'vitest';
import {
  DEFAULT_LINKE_TURBIDITY_MONTHLY,
  clearSkyHaurwitz1945,
  clearSkyIneichenPerez2002,
  getClearSky,
  linkeTurbidityForMonth,
} from '@/lib/solar/clearsky';
import { solarPositionSpa } from '@/lib/solar/position';

const D = Math.PI / 180;

describe('clearSkyHaurwitz1945', () => {
  // Haurwitz 1945, J. Meteorol. 2:154–166: GHI = 1098·cos z·exp(−0.059/cos z), 0 for z ≥ 90°.
  const h = (z: number) => 1098 * Math.cos(z * D) * Math.exp(-0.059 / Math.cos(z * D));

  it('matches the published formula', () => {
    for (const z of [0, 20, 45, 60, 75, 85, 89.5]) {
      expect(Math.abs(clearSkyHaurwitz1945(z).ghiWm2 - h(z))).toBeLessThan(1e-9);
    }
    // Hand values: z = 0 → 1098·e^−0.059 ≈ 1035.1 W/m²; z = 60° → 549·e^−0.118 ≈ 487.9 W/m².
    expect(Math.abs(clearSkyHaurwitz1945(0).ghiWm2 - 1035.1)).toBeLessThan(0.1);
    expect(Math.abs(clearSkyHaurwitz1945(60).ghiWm2 - 487.9)).toBeLessThan(0.1);
  });

  it('is zero at and below the horizon', () => {
    expect(clearSkyHaurwitz1945(90).ghiWm2).toBe(0);
    expect(clearSkyHaurwitz1945(120).ghiWm2).toBe(0);
  });
});

describe('clearSkyIneichenPerez2002', () => {
  // Ineichen & Perez 2002, Solar Energy 73(3):151–157 (formula as in lib/REFERENCES.md), with Kasten & Young 1989
  // relative air mass, evaluated independently here.
  const ip = (z: number, h: number, tl: number, i0: number) => {
    const am = 1 / (Math.cos(z * D) + 0.50572 * (96.07995 - z) ** -1.6364);
    const cg1 = 5.09e-5 * h + 0.868;
    const cg2 = 3.92e-5 * h + 0.0387;
    const fh1 = Math.exp(-h / 8000);
    const fh2 = Math.exp(-h / 1250);
    const ghi = cg1 * i0 * Math.cos(z * D) * Math.exp(-cg2 * am * (fh1 + fh2 * (tl - 1)));
    const dni = (0.664 + 0.163 / fh1) * i0 * Math.exp(-0.09 * am * (tl - 1));
    return { ghi, dni };
  };

  it('GHI and DNI match the published formulas at several points', () => {
    const points: [number, number, number, number][] = [
      [0, 0, 2, 1361],
      [30, 0, 3, 1361],
      [48.19, 500, 3.5, 1400],
      [60, 1500, 4, 1320],
      [75, 2500, 5, 1361],
    ];
    for (const [z, h, tl, i0] of points) {
      const r = clearSkyIneichenPerez2002({ zenithDeg: z, altitudeM: h, linkeTurbidity: tl, i0Wm2: i0 });
      const e = ip(z, h, tl, i0);
      expect(Math.abs(r.ghiWm2 - e.ghi)).toBeLessThan(1e-9);
      // DNI follows the beam formula unless limited by DNI·cos z ≤ GHI (then DHI = 0).
      const dniExpected = Math.min(e.dni, e.ghi / Math.cos(z * D));
      expect(Math.abs(r.dniWm2 - dniExpected)).toBeLessThan(1e-9);
      expect(r.dhiWm2).toBeGreaterThanOrEqual(0);
      expect(Math.abs(r.dhiWm2 + r.dniWm2 * Math.cos(z * D) - r.ghiWm2)).toBeLessThan(1e-9);
    }
  });

  it('hand check at sea level, TL = 3, z = 0: GHI ≈ 0.868·1361·exp(−0.0387·AM·3)', () => {
    // AM(0) = 0.99971 (Kasten & Young 1989); GHI ≈ 1181.5·e^−0.11607 ≈ 1052.0 W/m² (hand computation).
    const r = clearSkyIneichenPerez2002({ zenithDeg: 0, altitudeM: 0, linkeTurbidity: 3 });
    expect(Math.abs(r.ghiWm2 - 1052.0)).toBeLessThan(0.5);
  });

  it('more turbidity gives less light; higher sites get more; night is zero', () => {
    const a = clearSkyIneichenPerez2002({ zenithDeg: 40, altitudeM: 0, linkeTurbidity: 2.5 }).ghiWm2;
    const b = clearSkyIneichenPerez2002({ zenithDeg: 40, altitudeM: 0, linkeTurbidity: 5 }).ghiWm2;
    const c = clearSkyIneichenPerez2002({ zenithDeg: 40, altitudeM: 2000, linkeTurbidity: 2.5 }).ghiWm2;
    expect(b).toBeLessThan(a);
    expect(c).toBeGreaterThan(a);
    expect(clearSkyIneichenPerez2002({ zenithDeg: 90.1, altitudeM: 0, linkeTurbidity: 3 })).toEqual({ ghiWm2: 0, dniWm2: 0, dhiWm2: 0 });
  });

  it('energy sanity: a clear equinox day at 15° N gives 6–8 kWh/m² and a daily clearness of 0.6–0.8', () => {
    // Common practice, no source: clear-sky daily GHI in the tropics is typically 6–8 kWh/m², KT 0.6–0.8.
    let ghi = 0;
    let ext = 0;
    const stepMin = 2;
    for (let m = 0; m < 1440; m += stepMin) {
      const p = solarPositionSpa({ timeMs: Date.UTC(2024, 2, 20, 0, m + stepMin / 2), latitudeDeg: 15, longitudeDeg: 0, altitudeM: 300 });
      const i0 = 1361 / p.earthSunDistanceAu ** 2;
      ghi += clearSkyIneichenPerez2002({ zenithDeg: p.zenithDeg, altitudeM: 300, linkeTurbidity: 3.5, i0Wm2: i0 }).ghiWm2 * stepMin * 60;
      ext += Math.max(0, Math.cos(p.zenithNoRefractionDeg * D)) * i0 * stepMin * 60;
    }
    const kWh = ghi / 3.6e6;
    expect(kWh).toBeGreaterThan(6);
    expect(kWh).toBeLessThan(8);
    expect(ghi / ext).toBeGreaterThan(0.6);
    expect(ghi / ext).toBeLessThan(0.8);
  });
});

describe('getClearSky dispatcher', () => {
  it('dispatches by model and fills defaults', () => {
    const ip = getClearSky({ zenithDeg: 30 });
    expect(ip.model).toBe('ineichen-perez-2002');
    expect(Math.abs(ip.ghiWm2 - clearSkyIneichenPerez2002({ zenithDeg: 30, altitudeM: 0, linkeTurbidity: 3 }).ghiWm2)).toBeLessThan(1e-12);
    const hz = getClearSky({ model: 'haurwitz-1945', zenithDeg: 30 });
    expect(hz.dniWm2).toBeNull();
    expect(Math.abs(hz.ghiWm2 - clearSkyHaurwitz1945(30).ghiWm2)).toBeLessThan(1e-12);
  });

  it('refuses an unknown model with a message naming the choices', () => {
    expect(() => getClearSky({ model: 'bird' as 'haurwitz-1945', zenithDeg: 30 })).toThrow(RangeError);
    expect(() => getClearSky({ model: 'bird' as 'haurwitz-1945', zenithDeg: 30 })).toThrow(/'ineichen-perez-2002', 'haurwitz-1945'/);
  });

  it('refuses an impossible Linke turbidity, naming it', () => {
    expect(() => getClearSky({ zenithDeg: 30, linkeTurbidity: 0.5 })).toThrow(/linkeTurbidity/);
  });
});

describe('monthly Linke turbidity', () => {
  it('default table: 12 values between 3.0 and 4.5 (common practice, no source)', () => {
    expect(DEFAULT_LINKE_TURBIDITY_MONTHLY.length).toBe(12);
    for (const v of DEFAULT_LINKE_TURBIDITY_MONTHLY) {
      expect(v).toBeGreaterThanOrEqual(3.0);
      expect(v).toBeLessThanOrEqual(4.5);
    }
  });

  it('shifts six months south of the equator and honours a 12-value override', () => {
    expect(linkeTurbidityForMonth(0, 20)).toBe(DEFAULT_LINKE_TURBIDITY_MONTHLY[0]);
    expect(linkeTurbidityForMonth(0, -20)).toBe(DEFAULT_LINKE_TURBIDITY_MONTHLY[6]);
    const mine = [2, 2.1, 2.2, 2.3, 2.4, 2.5, 2.6, 2.7, 2.8, 2.9, 3, 3.1];
    expect(linkeTurbidityForMonth(11, -20, mine)).toBe(3.1);
  });

  it('rejects an override that is not 12 values within [1, 10], naming the field', () => {
    expect(() => linkeTurbidityForMonth(0, 0, [3, 3, 3])).toThrow(/linkeTurbidity must hold 12/);
    expect(() => linkeTurbidityForMonth(0, 0, [3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, NaN])).toThrow(/linkeTurbidity\[11\]/);
  });
});
