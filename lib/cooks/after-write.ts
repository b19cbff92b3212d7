import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen } from '@/entities';
import { getBossClient } from '@/lib/jobs/client';
import { rescheduleAfterCheckIn, rescheduleAfterReading, type Clock } from '@/lib/alerts/schedule';

export type CooksWrite =
  | { kind: 'check-in'; em: EntityManager; kitchen: Kitchen; planDate: string; batchId: string; checkKind: 'started' | 'done' | 'skipped'; who: string; fuel: string }
  | { kind: 'reading'; em: EntityManager; kitchen: Kitchen; cookerId: string };

/**
 * What a check-in or reading changes in the alerts, run after it is stored. Best effort: the entry is
 * kept whatever happens here (an unreachable pg-boss is logged; the next reading or the worker's
 * start brings the alerts up to date).
 */
export async function afterCooksWrite(w: CooksWrite, clock?: Clock): Promise<void> {
  try {
    const boss = await getBossClient(w.em.config.get('clientUrl'));
    const deps = { em: w.em.fork(), boss, ...(clock ? { clock } : {}) };
    if (w.kind === 'check-in') await rescheduleAfterCheckIn(deps, w.kitchen, { planDate: w.planDate, batchId: w.batchId, kind: w.checkKind, who: w.who, fuel: w.fuel });
    else await rescheduleAfterReading(deps, w.kitchen, w.cookerId);
  } catch (err) {
    console.error(`[cooks] alerts not updated after a ${w.kind}:`, err);
  }
}
