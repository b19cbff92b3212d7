/**
 * The cook's Today page: today's published plan as the day's model reads it (lib/day/model.ts, loaded
 * by lib/plans/day.ts) — each slot's state, ready times re-predicted from the latest readings, backup
 * fuel, warnings — and tomorrow's published plan for the evening's preparations. Cooks never see drafts.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen, Role } from '@/entities';
import { roleCan } from '@/lib/auth/permissions';
import type { DayBackup, DayCooker, DaySlot, DayWarning, KitchenDay } from '@/lib/day/model';
import { kitchenDate, loadKitchenDay } from '@/lib/plans/day';
import { getVapidKeys } from '@/lib/push/vapid';
import { addDays } from '@/lib/time';

export type TodaySlot = DaySlot;
export type TodayCooker = DayCooker;
export type TodayWarning = DayWarning;
export type TodayBackup = DayBackup;

export interface TodayPageData {
  kitchen: { id: string; name: string; timeZone: string };
  date: string;
  serverNowMs: number;
  role: Role;
  canLog: boolean;
  plan: KitchenDay['plan'];
  cookers: DayCooker[];
  backup: DayBackup[];
  warnings: DayWarning[];
  servings: KitchenDay['servings'];
  /** Tomorrow's published plan, if there is one yet. */
  tomorrow: Pick<KitchenDay, 'date' | 'plan' | 'cookers' | 'backup' | 'servings'> | null;
  vapidPublicKey: string;
}

export async function getTodayPage(em: EntityManager, kitchen: Kitchen, role: Role, nowMs = Date.now()): Promise<TodayPageData> {
  const date = kitchenDate(kitchen, nowMs);
  const [today, tomorrow, vapid] = await Promise.all([loadKitchenDay(em.fork(), kitchen, nowMs, date), loadKitchenDay(em.fork(), kitchen, nowMs, addDays(date, 1)), getVapidKeys(em)]);
  return {
    kitchen: today.kitchen,
    date,
    serverNowMs: nowMs,
    role,
    canLog: roleCan(role, 'log-cooking'),
    plan: today.plan,
    cookers: today.cookers,
    backup: today.backup,
    warnings: today.warnings,
    servings: today.servings,
    tomorrow: tomorrow.plan ? { date: tomorrow.date, plan: tomorrow.plan, cookers: tomorrow.cookers, backup: tomorrow.backup, servings: tomorrow.servings } : null,
    vapidPublicKey: vapid.publicKey,
  };
}
