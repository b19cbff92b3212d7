import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen } from '@/entities';
import { getBossClient } from '@/lib/queues/client';
import { rescheduleKitchenAlerts, type Clock, type ScheduleSummary } from './schedule';

/**
 * The step every command runs after its transaction has committed (publish a plan, check a batch in,
 * record a reading): the kitchen's alerts for that day follow the day as it now stands. Best effort:
 * what the command wrote is kept whatever happens here (pg-boss has its own connection and cannot join
 * the transaction); a failure is logged, and the next command or the worker's start catches up.
 */
export async function rescheduleAlertsAfterCommit(em: EntityManager, kitchen: Kitchen, date: string, clock?: Clock): Promise<ScheduleSummary | null> {
  try {
    const boss = await getBossClient(em.config.get('clientUrl'));
    return await rescheduleKitchenAlerts({ em: em.fork(), boss, ...(clock ? { clock } : {}) }, kitchen, date);
  } catch (err) {
    console.error(`[alerts] the alerts of ${date} could not be rescheduled:`, err);
    return null;
  }
}
