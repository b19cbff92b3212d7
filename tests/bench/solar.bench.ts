/**
 * Solar core benchmark — a plain script, not a test:  npx tsx tests/bench/solar.bench.ts
 * Prints SPA evaluations per second and resolveWeatherToAperture days per second at 1-minute steps.
 * It asserts nothing about wall-clock time (figures depend on the machine and its load).
 */
import {
  clearSkyHourly,
  resolveWeatherToAperture,
  solarPositionNoaa,
  solarPositionSpa,
  solarPositionsSpaFast,
  type ApertureGeometry,
  type HourlyWeather,
  type Site,
} from '../../lib/solar/index';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

/** Runs fn repeatedly for ~ms milliseconds after a warm-up; returns the best of 5 rounds in calls per second. */
function rate(fn: () => void, ms = 400): number {
  for (let i = 0; i < 20; i++) fn();
  let best = 0;
  for (let round = 0; round < 5; round++) {
    let n = 0;
    const t0 = performance.now();
    let dt = 0;
    do {
      fn();
      n++;
      dt = performance.now() - t0;
    } while (dt < ms);
    best = Math.max(best, (n * 1000) / dt);
  }
  return best;
}

function fmt(x: number): string {
  return x >= 100 ? Math.round(x).toLocaleString('en-US') : x.toFixed(2);
}

const site: Site = { latitudeDeg: 12.37, longitudeDeg: -1.52, altitudeM: 300 };
const t0 = Date.UTC(2024, 2, 20);

// SPA, one instant per call (full algorithm with validation and all intermediate outputs).
let k = 0;
const spaPerS = rate(() => {
  solarPositionSpa({ timeMs: t0 + (k++ % 100_000) * 61_000, ...site, slopeDeg: 20, surfaceAzimuthDeg: 180 });
});
let j = 0;
const noaaPerS = rate(() => {
  solarPositionNoaa({ timeMs: t0 + (j++ % 100_000) * 61_000, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg });
});
const minuteTimes = new Float64Array(1440);
for (let i = 0; i < 1440; i++) minuteTimes[i] = t0 + i * 60_000 + 30_000;
const fastDaysPerS = rate(() => {
  solarPositionsSpaFast(minuteTimes, site);
});

// resolveWeatherToAperture, one day of 1-minute steps per call, for each kind of input.
const clear = clearSkyHourly(site, t0, t0 + DAY);
const ghiOnly: HourlyWeather[] = clear.map((h) => ({ t: h.t, ghiWm2: (h.ghiWm2 ?? 0) * 0.8, tAirC: h.tAirC }));
const cloudOnly: HourlyWeather[] = clear.map((h, i) => ({ t: h.t, cloudOkta: i % 9, tAirC: h.tAirC, windMS: 2 }));
const box: ApertureGeometry = { tracking: 'fixed', tiltDeg: 15, surfaceAzimuthDeg: 180, beamOnly: false };
const dish: ApertureGeometry = { tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 180, beamOnly: true };

const rows: [string, number][] = [
  ['DNI+DHI, box, SPA', rate(() => resolveWeatherToAperture(site, box, clear, 60))],
  ['GHI only (Erbs), box, SPA', rate(() => resolveWeatherToAperture(site, box, ghiOnly, 60))],
  ['cloud only (I-P × K-C), dish, SPA', rate(() => resolveWeatherToAperture(site, dish, cloudOnly, 60))],
  ['DNI+DHI, box, NOAA', rate(() => resolveWeatherToAperture(site, box, clear, 60, { solarModel: 'noaa' }))],
];
const week = clearSkyHourly(site, t0, t0 + 7 * DAY);
const weekPerS = rate(() => resolveWeatherToAperture(site, box, week, 60));

console.log('Solar core benchmark (Node ' + process.version + ')');
console.log(`  SPA (solarPositionSpa, full)         ${fmt(spaPerS)} evaluations/s  (${fmt(1e6 / spaPerS)} µs each)`);
console.log(`  SPA series (solarPositionsSpaFast)   ${fmt(fastDaysPerS * 1440)} evaluations/s  (${fmt(1000 / fastDaysPerS)} ms per 1440-step day)`);
console.log(`  NOAA (solarPositionNoaa)             ${fmt(noaaPerS)} evaluations/s`);
console.log('  resolveWeatherToAperture, 1-minute steps:');
for (const [name, perS] of rows) {
  console.log(`    ${name.padEnd(36)} ${fmt(perS)} days/s  (${fmt(1000 / perS)} ms/day)`);
}
console.log(`    ${'7-day series, box, SPA'.padEnd(36)} ${fmt(weekPerS * 7)} days/s  (${fmt(1000 / (weekPerS * 7))} ms/day)`);
