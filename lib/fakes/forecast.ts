/**
 * Local fake of the Open-Meteo forecast API: the same path (GET /v1/forecast), query parameters and JSON shape
 * as the documented service, so lib/forecast/open-meteo.ts cannot tell them apart. Deterministic and physically
 * plausible:
 * - irradiance: the Ineichen & Perez 2002 clear sky of lib/solar (clearSkyHourly, hourly means of 5-minute
 *   samples, sun by NREL SPA) for the requested place and elevation, times the Kasten & Czeplak 1980 cloud
 *   factor of a seeded cloud pattern (seed from latitude, longitude and date), split into beam and diffuse by
 *   Erbs et al. 1982 — zero at night. Values are Open-Meteo style: the mean of the PRECEDING hour;
 * - temperature: the daily cycle of lib/solar dailyAirTemperatureC, with a seeded daily range, cooler under
 *   cloud and with altitude (−6.5 K/km, the standard-atmosphere lapse rate);
 * - wind: a light breeze peaking in the afternoon;
 * - cloud_cover: the pattern itself, instantaneous, in %.
 * Failure modes for tests, set with POST /__control {mode, times?, clouds?}: '500' (HTTP 500 with Open-Meteo's
 * error body), 'timeout' (never answers), 'malformed' (truncated JSON), 'schema' (JSON of the wrong shape),
 * 'gap' (two hours missing). `times` limits the mode to that many requests, then 'ok' again. GET /__control
 * shows the state, the request count and the last query.
 */
import http from 'node:http';
import type { Socket } from 'node:net';
import { clearSkyHourly, cloudFactorKastenCzeplak1980, dailyAirTemperatureC, type Site } from '../solar';
import { mulberry32 } from '../random';

export const FAKE_MODES = ['ok', '500', 'timeout', 'malformed', 'schema', 'gap'] as const;
export type FakeMode = (typeof FAKE_MODES)[number];

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;
const KNOWN_HOURLY = ['shortwave_radiation', 'direct_normal_irradiance', 'diffuse_radiation', 'temperature_2m', 'wind_speed_10m', 'cloud_cover'] as const;
type Var = (typeof KNOWN_HOURLY)[number];
const UNITS: Record<Var, string> = {
  shortwave_radiation: 'W/m²',
  direct_normal_irradiance: 'W/m²',
  diffuse_radiation: 'W/m²',
  temperature_2m: '°C',
  wind_speed_10m: 'm/s',
  cloud_cover: '%',
};

/** FNV-1a 32-bit hash of a string (seed material). */
function hash32(s: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}


interface DayPattern {
  /** Cloud cover [%] at 00:00 … 24:00 UTC (25 knots). */
  cover: number[];
  minC: number;
  maxC: number;
  /** Wind noise per hour [m/s]. */
  gust: number[];
}

/** The seeded weather of one UTC day at a place: the same request always gives the same answer. */
function dayPattern(lat: number, lon: number, elevationM: number, dayStartMs: number, clouds: boolean): DayPattern {
  const rng = mulberry32(hash32(`${lat.toFixed(2)},${lon.toFixed(2)},${new Date(dayStartMs).toISOString().slice(0, 10)}`));
  const r = rng();
  const base = r < 0.55 ? 5 : r < 0.85 ? 35 : 75; // clear, partly cloudy or overcast day
  const cover: number[] = [];
  let c = base;
  for (let k = 0; k <= 24; k++) {
    c = Math.min(100, Math.max(0, c + (rng() - 0.5) * 24 + (base - c) * 0.3));
    cover.push(clouds ? Math.round(c) : 0);
  }
  const meanCover = cover.reduce((a, b) => a + b, 0) / cover.length / 100;
  const baseC = 31 - 0.3 * Math.abs(lat) - 6.5 * (elevationM / 1000) + (rng() - 0.5) * 3;
  const gust = Array.from({ length: 25 }, () => rng());
  return { cover, minC: baseC - 7, maxC: baseC + 6 - 4 * meanCover, gust };
}

export interface FakeQuery {
  latitude: number;
  longitude: number;
  elevationM: number;
  vars: Var[];
  pastDays: number;
  forecastDays: number;
  windUnit: 'ms' | 'kmh';
}

/**
 * The fake's answer for a query at an instant, as Open-Meteo would shape it (timezone GMT).
 * @param q place, elevation [m], variables, past and forecast days, wind unit
 * @param nowMs the fake's clock [epoch ms]; the series starts at UTC midnight of today − pastDays
 * @param clouds false for a cloudless sky (clear-sky checks)
 */
export function fakeForecastBody(q: FakeQuery, nowMs: number, clouds = true) {
  const start = Math.floor(nowMs / DAY_MS) * DAY_MS - q.pastDays * DAY_MS;
  const n = 24 * (q.pastDays + q.forecastDays);
  const site: Site = { latitudeDeg: q.latitude, longitudeDeg: q.longitude, altitudeM: q.elevationM };
  // Hour i of `clear` is [start − 1 h + i·h, start + i·h): the preceding hour of the time stamped start + i·h.
  const clear = clearSkyHourly(site, start - HOUR_MS, start + (n - 1) * HOUR_MS);
  const patterns = new Map<number, DayPattern>();
  const pattern = (t: number) => {
    const d = Math.floor(t / DAY_MS) * DAY_MS;
    let p = patterns.get(d);
    if (!p) patterns.set(d, (p = dayPattern(q.latitude, q.longitude, q.elevationM, d, clouds)));
    return p;
  };
  const coverAt = (t: number) => pattern(t).cover[Math.round((t % DAY_MS) / HOUR_MS)] as number;
  const out: Record<Var, number[]> & { time: string[] } = {
    time: [],
    shortwave_radiation: [],
    direct_normal_irradiance: [],
    diffuse_radiation: [],
    temperature_2m: [],
    wind_speed_10m: [],
    cloud_cover: [],
  };
  const r1 = (x: number) => Math.round(x * 10) / 10;
  for (let i = 0; i < n; i++) {
    const t = start + i * HOUR_MS;
    out.time.push(new Date(t).toISOString().slice(0, 16));
    const cs = clear[i]!;
    let ghi = cs.ghiWm2 ?? 0;
    let dni = cs.dniWm2 ?? 0;
    let dhi = cs.dhiWm2 ?? 0;
    const okta = (coverAt(t - HOUR_MS) + coverAt(t)) / 2 / 12.5;
    if (ghi > 0 && okta > 0) {
      const cloudy = clearSkyHourly(site, t - HOUR_MS, t, { clearness: cloudFactorKastenCzeplak1980(okta) })[0]!;
      ghi = cloudy.ghiWm2 ?? 0;
      dni = cloudy.dniWm2 ?? 0;
      dhi = cloudy.dhiWm2 ?? 0;
    }
    out.shortwave_radiation.push(r1(ghi));
    out.direct_normal_irradiance.push(r1(dni));
    out.diffuse_radiation.push(r1(dhi));
    const p = pattern(t);
    const solarHour = t / HOUR_MS + q.longitude / 15;
    // Daily minimum and maximum blend into the next day's through the day, so the temperature has no step at 00:00 UTC.
    const next = pattern(t + DAY_MS);
    const f = (t % DAY_MS) / DAY_MS;
    const minC = (1 - f) * p.minC + f * next.minC;
    const maxC = (1 - f) * p.maxC + f * next.maxC;
    out.temperature_2m.push(r1(dailyAirTemperatureC(solarHour, minC, maxC)));
    const sh = ((solarHour % 24) + 24) % 24;
    const windMs = 1.5 + 2.5 * Math.max(0, Math.sin((Math.PI * (sh - 8)) / 12)) + (p.gust[Math.round((t % DAY_MS) / HOUR_MS)] as number);
    out.wind_speed_10m.push(Math.round((q.windUnit === 'ms' ? windMs : windMs * 3.6) * 100) / 100);
    out.cloud_cover.push(coverAt(t));
  }
  const hourly: Record<string, unknown> = { time: out.time };
  const hourlyUnits: Record<string, string> = { time: 'iso8601' };
  for (const v of q.vars) {
    hourly[v] = out[v];
    hourlyUnits[v] = v === 'wind_speed_10m' && q.windUnit === 'kmh' ? 'km/h' : UNITS[v];
  }
  return {
    latitude: Math.round(q.latitude * 100) / 100,
    longitude: Math.round(q.longitude * 100) / 100,
    generationtime_ms: 0.5,
    utc_offset_seconds: 0,
    timezone: 'GMT',
    timezone_abbreviation: 'GMT',
    elevation: q.elevationM,
    hourly_units: hourlyUnits,
    hourly,
  };
}

class BadRequest extends Error {}

/** Reads a query like Open-Meteo does; throws BadRequest with its style of reason. */
export function parseFakeQuery(params: URLSearchParams): FakeQuery {
  const num = (k: string, lo: number, hi: number, dflt?: number) => {
    const raw = params.get(k);
    if (raw === null) {
      if (dflt !== undefined) return dflt;
      throw new BadRequest(`Parameter '${k}' is required`);
    }
    const v = Number(raw);
    if (!Number.isFinite(v) || v < lo || v > hi) throw new BadRequest(`Parameter '${k}' must be a number between ${lo} and ${hi}`);
    return v;
  };
  const vars = (params.get('hourly') ?? '').split(',').filter(Boolean);
  for (const v of vars) {
    if (!(KNOWN_HOURLY as readonly string[]).includes(v)) throw new BadRequest(`Cannot initialize WeatherVariable from invalid String value ${v}`);
  }
  const tz = params.get('timezone') ?? 'GMT';
  if (!['GMT', 'UTC'].includes(tz)) throw new BadRequest('This fake answers in timezone=GMT only');
  const unit = params.get('wind_speed_unit') ?? 'kmh';
  if (unit !== 'ms' && unit !== 'kmh') throw new BadRequest(`This fake knows wind_speed_unit=ms or kmh, not ${unit}`);
  return {
    latitude: num('latitude', -90, 90),
    longitude: num('longitude', -180, 180),
    elevationM: num('elevation', -500, 9000, 0),
    vars: vars as Var[],
    pastDays: Math.round(num('past_days', 0, 92, 0)),
    forecastDays: Math.round(num('forecast_days', 0, 16, 7)),
    windUnit: unit,
  };
}

export interface ForecastFakeState {
  mode: FakeMode;
  /** Requests left in the mode before it returns to 'ok'; null = until changed. */
  remaining: number | null;
  clouds: boolean;
  requests: number;
  lastQuery: string | null;
}

export interface ForecastFake {
  port: number;
  url: string;
  state: ForecastFakeState;
  setMode(mode: FakeMode, opts?: { times?: number; clouds?: boolean }): void;
  close(): Promise<void>;
}

/** Starts the fake on loopback. Port 0 picks a free port. */
export async function startForecastFake(opts: { port: number; clouds?: boolean; now?: () => number }): Promise<ForecastFake> {
  const state: ForecastFakeState = { mode: 'ok', remaining: null, clouds: opts.clouds ?? true, requests: 0, lastQuery: null };
  const now = opts.now ?? Date.now;
  const sockets = new Set<Socket>();
  const setMode = (mode: FakeMode, o?: { times?: number; clouds?: boolean }) => {
    state.mode = mode;
    state.remaining = o?.times ?? null;
    if (o?.clouds !== undefined) state.clouds = o.clouds;
  };
  const send = (res: http.ServerResponse, status: number, body: string, type = 'application/json; charset=utf-8') => {
    res.writeHead(status, { 'content-type': type, 'content-length': Buffer.byteLength(body) });
    res.end(body);
  };

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    if (url.pathname === '/__control') {
      if (req.method === 'GET') return send(res, 200, JSON.stringify(state));
      if (req.method !== 'POST') return send(res, 405, '{"error":true,"reason":"GET or POST"}');
      const chunks: Buffer[] = [];
      req.on('data', (c: Buffer) => chunks.push(c));
      req.on('end', () => {
        try {
          const b = JSON.parse(Buffer.concat(chunks).toString('utf8') || '{}') as { mode?: string; times?: number; clouds?: boolean; reset?: boolean };
          const mode = (b.mode ?? 'ok') as FakeMode;
          if (!FAKE_MODES.includes(mode)) return send(res, 400, JSON.stringify({ error: true, reason: `mode is one of ${FAKE_MODES.join(', ')}` }));
          setMode(mode, { times: b.times, clouds: b.clouds });
          if (b.reset) state.requests = 0;
          send(res, 200, JSON.stringify(state));
        } catch {
          send(res, 400, '{"error":true,"reason":"send JSON"}');
        }
      });
      return;
    }
    if (url.pathname !== '/v1/forecast' || req.method !== 'GET') return send(res, 404, '{"error":true,"reason":"Not Found"}');

    state.requests++;
    state.lastQuery = url.search;
    const mode = state.mode;
    if (state.remaining !== null && --state.remaining <= 0) {
      state.mode = 'ok';
      state.remaining = null;
    }
    if (mode === 'timeout') return; // hold the request; the client's timeout must fire
    if (mode === '500') return send(res, 500, JSON.stringify({ error: true, reason: 'Internal server error (fake)' }));
    let q: FakeQuery;
    try {
      q = parseFakeQuery(url.searchParams);
    } catch (err) {
      if (err instanceof BadRequest) return send(res, 400, JSON.stringify({ error: true, reason: err.message }));
      throw err;
    }
    const body = fakeForecastBody(q, now(), state.clouds);
    if (mode === 'malformed') return send(res, 200, JSON.stringify(body).slice(0, 120));
    if (mode === 'schema') {
      const h = body.hourly as Record<string, unknown[]>;
      if (h.shortwave_radiation) h.shortwave_radiation[12] = 'bright';
      delete h.diffuse_radiation;
      return send(res, 200, JSON.stringify(body));
    }
    if (mode === 'gap') {
      const h = body.hourly as Record<string, unknown[]>;
      for (const k of Object.keys(h)) h[k]!.splice(30, 2);
    }
    send(res, 200, JSON.stringify(body));
  });
  server.on('connection', (s) => {
    sockets.add(s);
    s.on('close', () => sockets.delete(s));
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, '127.0.0.1', () => resolve());
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;
  return {
    port,
    url: `http://127.0.0.1:${port}`,
    state,
    setMode,
    close: () =>
      new Promise<void>((r) => {
        for (const s of sockets) s.destroy();
        server.close(() => r());
      }),
  };
}
