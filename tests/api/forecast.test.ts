/**
 * Forecast API over HTTP against the production build: GET the day's weather (any role), POST uploads (kitchen
 * lead only), the 5 MB limit, file errors listed by line with nothing saved, the guard, and the OpenAPI document.
 * The CSV and EPW files are written by hand after the documented formats (lib/forecast/csv.ts; EnergyPlus
 * Auxiliary Programs, EPW data dictionary).
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { ForecastSchema, type Kitchen } from '../../entities';
import { refreshKitchenForecast } from '../../lib/forecast/refresh';
import { addDays, localDateString } from '../../lib/time';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, testOrm, type World } from '../helpers/fixtures';

let w: World;
const c: Record<string, Client> = {};
const tomorrow = () => addDays(localDateString(Date.now(), 'Africa/Ouagadougou'), 1);

/** Our CSV: the given UTC day and the one before, a clear-ish day shape (sun 06:00–18:00 UTC at −1.5° E). */
function csvFor(date: string, opts: { badLine?: boolean } = {}) {
  const lines = ['time,ghi_w_m2,dni_w_m2,dhi_w_m2,temp_c,wind_m_s,cloud_okta'];
  for (const d of [addDays(date, -1), date]) {
    for (let h = 0; h < 24; h++) {
      const s = Math.max(0, Math.sin((Math.PI * (h + 0.5 - 6)) / 12));
      lines.push(`${d}T${String(h).padStart(2, '0')}:00Z,${Math.round(850 * s)},${Math.round(800 * s)},${Math.round(110 * s)},${(22 + 9 * s).toFixed(1)},2.5,1`);
    }
  }
  if (opts.badLine) {
    lines[3] = lines[3]!.replace(/,\d+,/, ',1800,'); // line 4: global irradiance out of range
    lines[5] = `${date}T99:00Z,1,1,1,1,1,1`; // line 6: bad time
  }
  return lines.join('\n');
}

/** An EPW fragment of a typical year (year 2005, UTC+0): the day before and the day of the given date. */
function epwFor(date: string) {
  const header = [
    'LOCATION,Ouagadougou,-,BFA,Hand-written test file,655030,12.35,-1.52,0.0,306.0',
    'DESIGN CONDITIONS,0',
    'TYPICAL/EXTREME PERIODS,0',
    'GROUND TEMPERATURES,0',
    'HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0',
    'COMMENTS 1,Written by hand for the Hearthcast tests',
    'COMMENTS 2,-',
    'DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31',
  ];
  const rows: string[] = [];
  for (const d of [addDays(date, -1), date]) {
    const [, m, day] = d.split('-').map(Number) as [number, number, number];
    for (let h = 1; h <= 24; h++) {
      const s = Math.max(0, Math.sin((Math.PI * (h - 0.5 - 6)) / 12));
      rows.push([2005, m, day, h, 0, '?9?9?9?9E0?9?9?9?9?9?9?9?9?9?9?9?9?9?9*9*9?9*9*9', (21 + 9 * s).toFixed(1), 8, 30, 97000, 0, 0, 380, Math.round(700 * s), Math.round(600 * s), Math.round(150 * s), 999999, 999999, 999999, 9999, 90, 2.0, 3, 0, 30, 77777, 9, 999999999, 20, 0.1, 0, 88, 0.2, 0, 0].join(','));
    }
  }
  return [...header, ...rows].join('\n');
}

function form(file: Blob, name: string, fields: Record<string, string>) {
  const f = new FormData();
  f.set('file', file, name);
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

async function countForecasts(k: Kitchen) {
  return (await testOrm()).em.fork().count(ForecastSchema, { kitchen: k.id });
}

beforeAll(async () => {
  w = await createWorld();
  for (const who of ['coordinator', 'leadA', 'cookA', 'otherLead', 'otherCoordinator'] as const) c[who] = await new Client().signIn(w.emails[who], PASSWORD);
});
afterAll(closeTestOrm);

describe('GET /api/v1/kitchens/{id}/forecast', () => {
  it('before any forecast: the clear-sky fallback, said so, for today in the kitchen zone', async () => {
    const r = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast`);
    expect(r.status).toBe(200);
    expect(r.json.source).toBe('clear-sky');
    expect(r.json.date).toBe(localDateString(Date.now(), 'Africa/Ouagadougou'));
    expect(r.json.hours).toHaveLength(24);
    expect(r.json.fetchedAt).toBeNull();
    expect(r.json.note).toMatch(/clear sky × the month's clear-sky index 0.75 \(default: common practice, no source\)/);
    expect(r.json.clearness.isDefault).toBe(true);
  });

  it('after a refresh from the fake: the forecast, fresh, with its hours', async () => {
    await refreshKitchenForecast((await testOrm()).em.fork(), w.kitchenA, { baseUrl: inject('forecastUrl') });
    const r = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast?date=${tomorrow()}`);
    expect(r.status).toBe(200);
    expect(r.json.source).toBe('forecast');
    expect(r.json.ageS).toBeLessThan(120);
    expect(r.json.hours).toHaveLength(24);
    expect(r.json.hours.every((h: { filled: boolean }) => !h.filled)).toBe(true);
    expect(Math.max(...r.json.hours.map((h: { ghiWm2: number }) => h.ghiWm2))).toBeGreaterThan(200);
    // The day after the forecast's end falls back to clear sky.
    const far = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast?date=${addDays(tomorrow(), 5)}`);
    expect(far.json.source).toBe('clear-sky');
  });

  it('a cooker prediction uses the forecast and says how old it is', async () => {
    const cooker = await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/cookers`, {
      name: 'Dish 1', kind: 'dish', apertureM2: 3, tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 180, collectorModel: 'iso9806', eta0: 0.6, a1: 1.5, a2: 0.005,
      mediumId: 'sunflower-oil', storeMassKg: 80, storeUaWPerK: 2, maxSafeTempC: 190, minUsefulTempC: 100,
      pots: [{ name: 'Pot 1', volumeL: 40, massKg: 5, coupling: { kind: 'natural-convection', contactAreaM2: 0.3 }, lidAreaM2: 0.12, lidUWPerM2K: 8 }],
    });
    expect(cooker.status).toBe(201);
    const p = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/cookers/${cooker.json.id}/prediction?date=${tomorrow()}`);
    expect(p.status).toBe(200);
    expect(p.json.source).toBe('forecast');
    expect(p.json.weather.ageS).toBeLessThan(120);
    expect(p.json.weather.filledHoursInDay).toBe(0);
  });

  it('guards: other organisation 404; a lead of another kitchen 404; bad date 422', async () => {
    expect((await c.otherCoordinator!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast`)).status).toBe(404);
    expect((await c.leadA!.get(`/api/v1/kitchens/${w.kitchenB.id}/forecast`)).status).toBe(404);
    expect((await c.coordinator!.get(`/api/v1/kitchens/${w.kitchenB.id}/forecast`)).status).toBe(200);
    const bad = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast?date=2026-02-30`);
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.date).toBe('Not a real date.');
  });
});

describe('POST /api/v1/kitchens/{id}/forecast/uploads', () => {
  const url = () => `/api/v1/kitchens/${w.kitchenA.id}/forecast/uploads`;

  it('only the kitchen lead uploads: cook 403, coordinator 403, another organisation 404', async () => {
    const f = () => form(new Blob([csvFor(tomorrow())]), 'day.csv', { date: tomorrow(), mode: 'as-is' });
    expect((await c.cookA!.postForm(url(), f())).status).toBe(403);
    expect((await c.coordinator!.postForm(url(), f())).status).toBe(403);
    const other = await c.otherLead!.postForm(url(), f());
    expect(other.status).toBe(404);
    expect(other.json.error.message).toBe('Kitchen not found.');
  });

  it('a CSV for a day: saved, and the day now plans on the upload', async () => {
    const before = await countForecasts(w.kitchenA);
    const r = await c.leadA!.postForm(url(), form(new Blob([csvFor(tomorrow())]), 'my-station.csv', { date: tomorrow(), mode: 'as-is' }));
    expect(r.status).toBe(201);
    expect(r.json).toMatchObject({ source: 'upload', kind: 'csv', uploadName: 'my-station.csv', mode: 'as-is', date: tomorrow() });
    expect(r.json.hours).toBeGreaterThanOrEqual(24);
    expect(await countForecasts(w.kitchenA)).toBe(before + 1);
    const g = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast?date=${tomorrow()}`);
    expect(g.json.source).toBe('upload');
    expect(g.json.uploadName).toBe('my-station.csv');
    const noon = g.json.hours.find((h: { t: string }) => h.t === `${tomorrow()}T12:00:00.000Z`);
    expect(noon.ghiWm2).toBe(Math.round(850 * Math.sin((Math.PI * 6.5) / 12)));
    // The file's day before serves the store's spin-up only: that day stays on the forecast.
    const dayBefore = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast?date=${addDays(tomorrow(), -1)}`);
    expect(dayBefore.json.source).toBe('forecast');
    expect(r.json.coversFrom).toBe(`${tomorrow()}T00:00:00.000Z`);
    expect(r.json.coversTo).toBe(`${addDays(tomorrow(), 1)}T00:00:00.000Z`);
  });

  it('an EPW typical day for the date', async () => {
    const date = addDays(tomorrow(), 1);
    const r = await c.leadA!.postForm(url(), form(new Blob([epwFor(date)]), 'ouaga-tmy.epw', { date, mode: 'typical-day' }));
    expect(r.status).toBe(201);
    expect(r.json).toMatchObject({ kind: 'epw', mode: 'typical-day', warnings: [] });
    const g = await c.cookA!.get(`/api/v1/kitchens/${w.kitchenA.id}/forecast?date=${date}`);
    expect(g.json.source).toBe('upload');
    expect(g.json.uploadMode).toBe('typical-day');
  });

  it('a file with errors: 422 listing lines and fields, nothing saved', async () => {
    const before = await countForecasts(w.kitchenA);
    const r = await c.leadA!.postForm(url(), form(new Blob([csvFor(tomorrow(), { badLine: true })]), 'bad.csv', { date: tomorrow(), mode: 'as-is' }));
    expect(r.status).toBe(422);
    expect(r.json.error.code).toBe('invalid');
    expect(r.json.error.message).toBe('The file has 2 problems; nothing was saved.');
    expect(r.json.error.fields).toEqual({
      'line 4.ghi_w_m2': 'Must be between 0 and 1500 W/m²; got 1800.',
      'line 6.time': expect.stringMatching(/Not a real date/),
    });
    expect(await countForecasts(w.kitchenA)).toBe(before);
  });

  it('a file that does not cover the day, or typical-day with a CSV: 422 naming the field', async () => {
    const r = await c.leadA!.postForm(url(), form(new Blob([csvFor(tomorrow())]), 'day.csv', { date: addDays(tomorrow(), 3), mode: 'as-is' }));
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/does not cover/);
    expect(r.json.error.fields.date).toMatch(/The file covers/);
    const t = await c.leadA!.postForm(url(), form(new Blob([csvFor(tomorrow())]), 'day.csv', { date: tomorrow(), mode: 'typical-day' }));
    expect(t.status).toBe(422);
    expect(t.json.error.fields.mode).toMatch(/as-is/);
    const noDate = await c.leadA!.postForm(url(), form(new Blob([csvFor(tomorrow())]), 'day.csv', {}));
    expect(noDate.status).toBe(422);
    expect(noDate.json.error.fields.date).toBeTruthy();
  });

  it('a 20 MB file is refused with 413, and so is one just over 5 MB', async () => {
    const big = await c.leadA!.postForm(url(), form(new Blob([new Uint8Array(20 * 1024 * 1024).fill(48)]), 'big.csv', { date: tomorrow(), mode: 'as-is' }));
    expect(big.status).toBe(413);
    expect(big.json.error.code).toBe('too_large');
    expect(big.json.error.message).toMatch(/larger than 5 MB/);
    const over = await c.leadA!.postForm(url(), form(new Blob([new Uint8Array(5 * 1024 * 1024 + 10_000).fill(48)]), 'over.csv', { date: tomorrow(), mode: 'as-is' }));
    expect(over.status).toBe(413);
  });

  it('not multipart: 400; no file: 400', async () => {
    expect((await c.leadA!.post(url(), { date: tomorrow() })).status).toBe(400);
    const f = new FormData();
    f.set('date', tomorrow());
    const r = await c.leadA!.postForm(url(), f);
    expect(r.status).toBe(400);
    expect(r.json.error.fields.file).toBeTruthy();
  });
});

describe('kitchen clearness and the OpenAPI document', () => {
  it('the coordinator sets the monthly clear-sky index; a lead cannot; 12 values in range', async () => {
    const values = [0.9, 0.9, 0.85, 0.8, 0.7, 0.55, 0.5, 0.5, 0.6, 0.8, 0.9, 0.9];
    const ok = await c.coordinator!.patch(`/api/v1/kitchens/${w.kitchenB.id}`, { clearness: values });
    expect(ok.status).toBe(200);
    expect(ok.json.clearness).toEqual({ values, isDefault: false });
    const g = await c.coordinator!.get(`/api/v1/kitchens/${w.kitchenB.id}/forecast`);
    expect(g.json.source).toBe('clear-sky');
    expect(g.json.clearness.isDefault).toBe(false);
    expect((await c.leadA!.patch(`/api/v1/kitchens/${w.kitchenA.id}`, { clearness: values })).status).toBe(403);
    const bad = await c.coordinator!.patch(`/api/v1/kitchens/${w.kitchenB.id}`, { clearness: values.slice(1) });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.clearness).toMatch(/12 monthly values/);
    const reset = await c.coordinator!.patch(`/api/v1/kitchens/${w.kitchenB.id}`, { clearness: null });
    expect(reset.json.clearness.isDefault).toBe(true);
  });

  it('documents both routes, the upload as multipart', async () => {
    const r = await new Client().get('/api/v1/openapi.json');
    const get = r.json.paths['/api/v1/kitchens/{kitchenId}/forecast'].get;
    const post = r.json.paths['/api/v1/kitchens/{kitchenId}/forecast/uploads'].post;
    expect(get.parameters.map((p: { name: string }) => p.name)).toEqual(['kitchenId', 'date']);
    expect(Object.keys(post.requestBody.content)).toEqual(['multipart/form-data']);
    expect(post.requestBody.content['multipart/form-data'].schema.properties.file.format).toBe('binary');
    expect(Object.keys(post.responses).sort()).toEqual(['201', '400', '401', '403', '404', '413', '422']);
  });
});

