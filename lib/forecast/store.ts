/**
 * Storage of forecasts: one Forecast row per issue (or failed fetch), its hours as ForecastPoint rows inserted
 * in one multi-row insert. Writes of a forecast and its points run in one transaction.
 */
import { randomUUID } from 'node:crypto';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { ForecastPointSchema, ForecastSchema, KitchenSchema, type Forecast as ForecastRow, type ForecastPoint, type Kitchen, type UploadMode } from '@/entities';
import type { HourlyWeather } from '@/lib/solar';
import { HOUR_MS } from './types';

/** Points per INSERT statement (well under PostgreSQL's 65 535 bind parameters at 11 columns). */
const INSERT_BATCH = 1000;

export interface NewForecast {
  source: 'service' | 'upload';
  issuedAtMs: number;
  fetchedAtMs: number;
  hours: readonly HourlyWeather[];
  uploadName?: string;
  uploadMode?: UploadMode;
  /**
   * The span the forecast is meant for [epoch ms]; default the span of its hours. An upload is meant for its
   * chosen day only (its hours of the day before serve the store's spin-up, not that day's plan).
   */
  coversFromMs?: number;
  coversToMs?: number;
  /** More writes in the same transaction (e.g. the audit event of an upload). */
  inTransaction?: (tx: EntityManager, forecastId: string) => void;
}

/**
 * Stores a good forecast with its hours, unless the same (kitchen, source, issue time) is already stored.
 * @returns the row's id and whether it was stored now (false: that issue was already there)
 */
export async function saveForecast(em: EntityManager, kitchen: Kitchen, f: NewForecast): Promise<{ id: string; stored: boolean }> {
  if (!f.hours.length) throw new RangeError('a forecast needs at least one hour');
  const existing = await em.findOne(ForecastSchema, { kitchen: kitchen.id, source: f.source, issuedAt: new Date(f.issuedAtMs) }, { fields: ['id'] });
  if (existing) return { id: existing.id, stored: false };
  const id = randomUUID();
  const now = new Date();
  try {
    await em.transactional(async (tx) => {
      tx.create(ForecastSchema, {
        id,
        kitchen: tx.getReference(KitchenSchema, kitchen.id),
        source: f.source,
        issuedAt: new Date(f.issuedAtMs),
        fetchedAt: new Date(f.fetchedAtMs),
        status: 'ok',
        error: null,
        coversFrom: new Date(f.coversFromMs ?? f.hours[0]!.t),
        coversTo: new Date(f.coversToMs ?? f.hours[f.hours.length - 1]!.t + HOUR_MS),
        uploadName: f.uploadName ?? null,
        uploadMode: f.uploadMode ?? null,
      });
      f.inTransaction?.(tx, id);
      await tx.flush();
      const rows = f.hours.map((h) => ({
        id: randomUUID(),
        createdAt: now,
        updatedAt: now,
        forecast: id,
        t: new Date(h.t),
        ghi: h.ghiWm2 ?? 0,
        dni: h.dniWm2 ?? null,
        dhi: h.dhiWm2 ?? null,
        tAirC: Number.isFinite(h.tAirC) ? h.tAirC : null,
        windMS: h.windMS ?? null,
        cloudOkta: h.cloudOkta ?? null,
      }));
      for (let i = 0; i < rows.length; i += INSERT_BATCH) {
        await tx.insertMany(ForecastPointSchema, rows.slice(i, i + INSERT_BATCH) as unknown as ForecastPoint[]);
      }
    });
  } catch (err) {
    // Another worker stored the same issue between our check and our insert: that is the idempotent outcome.
    if (err instanceof UniqueConstraintViolationException) {
      const row = await em.fork().findOne(ForecastSchema, { kitchen: kitchen.id, source: f.source, issuedAt: new Date(f.issuedAtMs) }, { fields: ['id'] });
      if (row) return { id: row.id, stored: false };
    }
    throw err;
  }
  return { id, stored: true };
}

/** Records a failed fetch (no issue time, no hours) so the page and the API can say what went wrong. */
export async function recordFailedFetch(em: EntityManager, kitchen: Kitchen, error: string, fetchedAtMs: number): Promise<string> {
  const row = em.create(ForecastSchema, {
    id: randomUUID(),
    kitchen: em.getReference(KitchenSchema, kitchen.id),
    source: 'service',
    issuedAt: null,
    fetchedAt: new Date(fetchedAtMs),
    status: 'failed',
    error: error.slice(0, 1000),
    coversFrom: null,
    coversTo: null,
    uploadName: null,
    uploadMode: null,
  });
  await em.flush();
  return row.id;
}

/**
 * Deletes forecasts whose hours ended before the retention window, and failed fetches older than it (their
 * points go with them: ON DELETE CASCADE).
 * @returns the number of forecasts deleted
 */
export async function pruneForecasts(em: EntityManager, retentionDays: number, nowMs = Date.now()): Promise<number> {
  const cutoff = new Date(nowMs - retentionDays * 86_400_000);
  return em.nativeDelete(ForecastSchema, {
    $or: [{ status: 'ok', coversTo: { $lt: cutoff } }, { status: 'failed', fetchedAt: { $lt: cutoff } }],
  });
}

/** A stored point as lib/solar HourlyWeather; a missing air temperature is left NaN for the caller to fill. */
export function pointToHour(p: Pick<ForecastPoint, 't' | 'ghi' | 'dni' | 'dhi' | 'tAirC' | 'windMS' | 'cloudOkta'>): HourlyWeather {
  const h: HourlyWeather = { t: p.t.getTime(), ghiWm2: p.ghi, tAirC: p.tAirC ?? Number.NaN };
  if (p.dni !== null && p.dhi !== null) {
    h.dniWm2 = p.dni;
    h.dhiWm2 = p.dhi;
  }
  if (p.windMS !== null) h.windMS = p.windMS;
  if (p.cloudOkta !== null) h.cloudOkta = p.cloudOkta;
  return h;
}

/** Hours of a stored forecast in [fromMs, toMs). */
export async function getForecastHours(em: EntityManager, forecastId: string, fromMs: number, toMs: number): Promise<HourlyWeather[]> {
  const points = await em.find(
    ForecastPointSchema,
    { forecast: forecastId, t: { $gte: new Date(fromMs), $lt: new Date(toMs) } },
    { orderBy: { t: 'asc' }, fields: ['t', 'ghi', 'dni', 'dhi', 'tAirC', 'windMS', 'cloudOkta'] },
  );
  return points.map(pointToHour);
}

export type { ForecastRow };
