/**
 * The Open-Meteo adapter against the local fake (same wire API), in process on a free port: the request, the
 * preceding-hour conversion, and each failure mode (HTTP 500 retried then failed, timeout, malformed JSON,
 * wrong shape, a gap in the hours). Convention checked: Open-Meteo documents radiation as the mean of the
 * preceding hour and temperature/wind/cloud cover as instantaneous (https://open-meteo.com/en/docs).
 */
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startForecastFake, type ForecastFake } from '@/lib/fakes/forecast';
import { convertOpenMeteo, fetchOpenMeteoForecast, openMeteoUrl, parseOpenMeteoBody } from '@/lib/forecast/open-meteo';
import { ForecastError } from '@/lib/forecast/types';

const H = 3_600_000;
// Fixed clock: 2 December 2026, 10:00 UTC.
const NOW = Date.UTC(2026, 11, 2, 10);
const site = { latitudeDeg: 12.3714, longitudeDeg: -1.5197, altitudeM: 305 };
let fake: ForecastFake;
const sleeps: number[] = [];
const fast = () => ({ baseUrl: fake.url, timeoutMs: 300, backoffMs: 5, sleep: async (ms: number) => void sleeps.push(ms), now: () => NOW });

beforeAll(async () => {
  fake = await startForecastFake({ port: 0, now: () => NOW });
});
afterAll(() => fake.close());
beforeEach(() => {
  fake.setMode('ok');
  fake.state.requests = 0;
  sleeps.length = 0;
});

describe('request', () => {
  it('asks for the documented variables in GMT with m/s wind, yesterday and four days, and the key when given', async () => {
    const u = new URL(openMeteoUrl(site, { baseUrl: 'https://api.example.org', apiKey: 'k-123' }));
    expect(u.pathname).toBe('/v1/forecast');
    expect(u.searchParams.get('hourly')).toBe('shortwave_radiation,direct_normal_irradiance,diffuse_radiation,temperature_2m,wind_speed_10m,cloud_cover');
    expect(u.searchParams.get('timezone')).toBe('GMT');
    expect(u.searchParams.get('wind_speed_unit')).toBe('ms');
    expect(u.searchParams.get('past_days')).toBe('1');
    expect(u.searchParams.get('forecast_days')).toBe('4');
    expect(u.searchParams.get('apikey')).toBe('k-123');
    expect(u.searchParams.get('elevation')).toBe('305');
    expect(new URL(openMeteoUrl(site, { baseUrl: 'https://api.example.org' })).searchParams.has('apikey')).toBe(false);
  });

  it('passes the API key through to the service', async () => {
    await fetchOpenMeteoForecast(site, { ...fast(), apiKey: 'secret-key' });
    expect(new URLSearchParams(fake.state.lastQuery ?? '').get('apikey')).toBe('secret-key');
  });
});

describe('conversion to our hours', () => {
  it('moves radiation to the start of the hour it describes and averages instantaneous values over the hour', () => {
    // A hand-made answer: three stamps; radiation at 11:00 is the mean of 10:00–11:00 (Open-Meteo docs).
    const body = JSON.stringify({
      latitude: 12.37,
      longitude: -1.52,
      hourly_units: { time: 'iso8601', shortwave_radiation: 'W/m²', direct_normal_irradiance: 'W/m²', diffuse_radiation: 'W/m²', temperature_2m: '°C', wind_speed_10m: 'm/s', cloud_cover: '%' },
      hourly: {
        time: ['2026-12-03T10:00', '2026-12-03T11:00', '2026-12-03T12:00'],
        shortwave_radiation: [700, 800, 850],
        direct_normal_irradiance: [800, 850, null],
        diffuse_radiation: [120, 130, null],
        temperature_2m: [30, 32, 33],
        wind_speed_10m: [2, 4, null],
        cloud_cover: [0, 25, 50],
      },
    });
    const f = convertOpenMeteo(parseOpenMeteoBody(body), site, NOW);
    expect(f.hours).toHaveLength(2);
    const [a, b] = f.hours as [NonNullable<(typeof f.hours)[0]>, NonNullable<(typeof f.hours)[0]>];
    expect(a.t).toBe(Date.UTC(2026, 11, 3, 10));
    expect(a.ghiWm2).toBe(800); // the value stamped 11:00
    expect(a.dniWm2).toBe(850);
    expect(a.dhiWm2).toBe(130);
    expect(Math.abs(a.tAirC - 31)).toBeLessThan(1e-12); // (30 + 32) / 2
    expect(Math.abs((a.windMS ?? NaN) - 3)).toBeLessThan(1e-12);
    expect(Math.abs((a.cloudOkta ?? NaN) - 1)).toBeLessThan(1e-12); // 12.5 % = 1 okta
    expect(b.t).toBe(Date.UTC(2026, 11, 3, 11));
    expect(b.ghiWm2).toBe(850);
    expect(b.dniWm2).toBeUndefined(); // null beam → global only
    expect(b.windMS).toBeUndefined();
    expect(Math.abs((b.cloudOkta ?? NaN) - 3)).toBeLessThan(1e-12); // (25 + 50) / 2 % = 37.5 % = 3 okta
  });

  it('the fake: yesterday and four GMT days, consecutive whole hours, zero sun at night', async () => {
    const f = await fetchOpenMeteoForecast(site, fast());
    // 5 days × 24 stamps → 119 hours (the first stamp describes the hour before the series).
    expect(f.hours).toHaveLength(119);
    expect(f.hours[0]!.t).toBe(Date.UTC(2026, 11, 1, 0));
    for (let i = 1; i < f.hours.length; i++) expect(f.hours[i]!.t - f.hours[i - 1]!.t).toBe(H);
    // Ouagadougou (UTC+0): 00:00–01:00 UTC is night, 12:00–13:00 near noon.
    const night = f.hours.find((h) => h.t === Date.UTC(2026, 11, 2, 0))!;
    const noon = f.hours.find((h) => h.t === Date.UTC(2026, 11, 2, 12))!;
    expect(night.ghiWm2).toBe(0);
    expect(noon.ghiWm2).toBeGreaterThan(300);
    expect(noon.ghiWm2).toBeLessThan(1100);
    for (const h of f.hours) {
      expect(h.tAirC).toBeGreaterThan(5);
      expect(h.tAirC).toBeLessThan(45);
      expect(h.cloudOkta!).toBeGreaterThanOrEqual(0);
      expect(h.cloudOkta!).toBeLessThanOrEqual(8);
    }
  });

  it('the fake is deterministic: the same request gives the same hours', async () => {
    const a = await fetchOpenMeteoForecast(site, fast());
    const b = await fetchOpenMeteoForecast(site, fast());
    expect(b.hours).toEqual(a.hours);
  });
});

describe('failure modes', () => {
  const fail = async (opts = fast()) => {
    try {
      await fetchOpenMeteoForecast(site, opts);
    } catch (err) {
      return err as ForecastError;
    }
    throw new Error('expected a failure');
  };

  it('HTTP 500 is retried 3 times with exponential back-off, then fails naming the status', async () => {
    fake.setMode('500');
    const err = await fail();
    expect(err).toBeInstanceOf(ForecastError);
    expect(err.kind).toBe('http');
    expect(err.status).toBe(500);
    expect(err.retryable).toBe(true);
    expect(err.message).toMatch(/HTTP 500.*after 3 tries/);
    expect(fake.state.requests).toBe(3);
    expect(sleeps).toEqual([5, 10]);
  });

  it('a 500 that clears up on the second try gives the forecast', async () => {
    fake.setMode('500', { times: 1 });
    const f = await fetchOpenMeteoForecast(site, fast());
    expect(f.hours.length).toBe(119);
    expect(fake.state.requests).toBe(2);
  });

  it('a timeout is retried, then fails as a timeout', async () => {
    fake.setMode('timeout');
    const t0 = Date.now();
    const err = await fail();
    expect(err.kind).toBe('timeout');
    expect(err.message).toMatch(/did not answer within 0.3 s/);
    expect(fake.state.requests).toBe(3);
    // Three tries of 300 ms each; generous upper bound for a loaded machine.
    expect(Date.now() - t0).toBeLessThan(5000);
  });

  it('malformed JSON is rejected at once (not retried)', async () => {
    fake.setMode('malformed');
    const err = await fail();
    expect(err.kind).toBe('malformed');
    expect(err.retryable).toBe(false);
    expect(err.message).toMatch(/not valid JSON/);
    expect(fake.state.requests).toBe(1);
  });

  it('JSON of the wrong shape is rejected by the schema, naming the field', async () => {
    fake.setMode('schema');
    const err = await fail();
    expect(err.kind).toBe('malformed');
    expect(err.message).toMatch(/hourly\.shortwave_radiation\.12/);
    expect(err.message).toMatch(/diffuse_radiation/);
  });

  it('a gap in the hours is rejected, naming where', async () => {
    fake.setMode('gap');
    const err = await fail();
    expect(err.kind).toBe('gap');
    expect(err.message).toMatch(/jump from 2026-12-02T05:00 to 2026-12-02T08:00/);
  });

  it('values out of physical range or in other units are rejected', () => {
    const base = {
      latitude: 12.37,
      longitude: -1.52,
      hourly_units: { time: 'iso8601', shortwave_radiation: 'W/m²', direct_normal_irradiance: 'W/m²', diffuse_radiation: 'W/m²', temperature_2m: '°C', wind_speed_10m: 'm/s', cloud_cover: '%' },
      hourly: { time: ['2026-12-03T10:00', '2026-12-03T11:00'], shortwave_radiation: [0, 2500], direct_normal_irradiance: [0, 0], diffuse_radiation: [0, 0], temperature_2m: [20, 21], wind_speed_10m: [1, 1], cloud_cover: [0, 0] },
    };
    expect(() => parseOpenMeteoBody(JSON.stringify(base))).toThrow(/shortwave_radiation \[W\/m²\] above 1500/);
    const kmh = { ...base, hourly: { ...base.hourly, shortwave_radiation: [0, 500] }, hourly_units: { ...base.hourly_units, wind_speed_10m: 'km/h' } };
    expect(() => parseOpenMeteoBody(JSON.stringify(kmh))).toThrow(/wind_speed_10m must be in m\/s/);
    const short = { ...base, hourly: { ...base.hourly, shortwave_radiation: [0] } };
    expect(() => parseOpenMeteoBody(JSON.stringify(short))).toThrow(/1 values for 2 times/);
  });

  it('a missing global irradiance is a gap; an answer for another place is rejected', () => {
    const body = (ghi: (number | null)[], lat = 12.37) =>
      parseOpenMeteoBody(
        JSON.stringify({
          latitude: lat,
          longitude: -1.52,
          hourly_units: { time: 'iso8601', shortwave_radiation: 'W/m²', direct_normal_irradiance: 'W/m²', diffuse_radiation: 'W/m²', temperature_2m: '°C', wind_speed_10m: 'm/s', cloud_cover: '%' },
          hourly: { time: ['2026-12-03T10:00', '2026-12-03T11:00'], shortwave_radiation: ghi, direct_normal_irradiance: [0, 0], diffuse_radiation: [0, 0], temperature_2m: [20, 21], wind_speed_10m: [1, 1], cloud_cover: [0, 0] },
        }),
      );
    expect(() => convertOpenMeteo(body([0, null]), site, NOW)).toThrow(/no shortwave_radiation for 2026-12-03T11:00/);
    expect(() => convertOpenMeteo(body([0, 10], 40), site, NOW)).toThrow(/answered for 40/);
  });

  it('an unreachable service is a network failure, retried', async () => {
    const err = await fail({ ...fast(), baseUrl: 'http://127.0.0.1:9' });
    expect(err.kind).toBe('network');
    expect(err.retryable).toBe(true);
    expect(sleeps).toEqual([5, 10]);
  });
});
