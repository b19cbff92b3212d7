import type { EntityManager } from '@mikro-orm/postgresql';
import { getBossClient } from '@/lib/jobs/client';
import { scheduleAlertsForPlan, type ScheduleSummary } from './schedule';

/**
 * Called by lib/plans publishDraft after its transaction: schedules the new version's alerts and
 * cancels the superseded version's. A failure here (pg-boss unreachable) does not undo the
 * publication; it is logged, and the worker schedules the day's alerts when it next starts.
 */
export async function scheduleAfterPublish(em: EntityManager, planId: string): Promise<ScheduleSummary | null> {
  try {
    const boss = await getBossClient(em.config.get('clientUrl'));
    return await scheduleAlertsForPlan({ em: em.fork(), boss }, planId);
  } catch (err) {
    console.error(`[alerts] could not schedule the alerts of plan ${planId}:`, err);
    return null;
  }
}
