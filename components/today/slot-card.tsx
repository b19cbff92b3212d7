'use client';

import { useFormatter, useTranslations } from '../mini-intl';
import { useState } from 'react';
import { SafetyList } from '../safety-list';
import { usePrefs } from '../prefs';
import { duration, type ShownSlot } from './phases';

export type CheckInKind = 'started' | 'done' | 'skipped';

/** One slot as a cook needs it next to the cooker: what, where, when it is hot enough, the safety notes, and the check-in buttons. */
export function SlotCard({ slot, nowMs, timeZone, canLog, onCheckIn, emphasis }: { slot: ShownSlot; nowMs: number; timeZone: string; canLog: boolean; onCheckIn: (kind: CheckInKind) => void; emphasis: 'now' | 'next' | 'later' }) {
  const t = useTranslations('today');
  const format = useFormatter();
  const { fmtTemp } = usePrefs();
  const [confirmSkip, setConfirmSkip] = useState(false);
  const clock = (ms: number) => format.dateTime(new Date(ms), { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
  const headingId = `slot-${slot.batchId}`;

  let readyLine: React.ReactNode;
  if (slot.readyMs === null) readyLine = <span className="font-semibold text-ember-800">{t('notReachable', { temp: fmtTemp(slot.minTempC) })}</span>;
  else if (slot.readyMs > nowMs) readyLine = (
    <>
      <span className="text-2xl font-bold">{t('readyAt', { time: clock(slot.readyMs) })}</span>{' '}
      <span className="text-lg font-semibold" data-testid="countdown">({t('readyIn', { duration: duration(slot.readyMs - nowMs) })})</span>
    </>
  );
  else if (slot.status === 'started') readyLine = <span className="text-2xl font-bold text-tide-700">{t('readyNow')}</span>;
  else readyLine = <span className="text-lg font-semibold">{t('readyPassed', { time: clock(slot.readyMs) })}</span>;

  const border = emphasis === 'now' ? 'border-4 border-ember-600' : emphasis === 'next' ? 'border-2 border-clay-900' : 'border border-clay-200';
  return (
    <article aria-labelledby={headingId} className={`rounded-xl bg-white p-4 shadow-sm ${border}`} data-batch={slot.batchId}>
      <h3 id={headingId} className="text-xl font-bold leading-tight">
        {t('slotTitle', { dish: slot.dishName, index: slot.index, of: slot.of })}
      </h3>
      <p className="text-lg">
        {t('servings', { servings: slot.servings })} · {t('potLine', { pot: slot.potName, time: clock(slot.startMs) })}
      </p>
      <p className="mt-2">{readyLine}</p>
      <p className="text-sm text-clay-700">
        {slot.readySource === 'reading' ? t('fromReading') : t('fromPlan')} · {t('needs', { temp: fmtTemp(slot.minTempC) })}
        {slot.storeAtStartC != null && ` · ${t('storeAtStart', { temp: fmtTemp(slot.storeAtStartC) })}`}
        {slot.potMaxC != null && `, ${t('potMax', { temp: fmtTemp(slot.potMaxC) })}`} · {t('serveBy', { time: clock(slot.serveByMs) })}
      </p>
      <p className="mt-1 font-semibold" role="status">
        {slot.status === 'planned' ? t('status.planned') : slot.status === 'started' ? t('status.started', { time: clock(slot.startedAt ?? slot.startMs) }) : ''}
        {slot.pending && ` · ${t('queued')}`}
      </p>
      <SafetyList notes={slot.safety} />
      {canLog && (
        <div className="mt-3 flex flex-wrap gap-2">
          {slot.status === 'planned' && (
            <button type="button" className="btn-primary min-h-14 flex-1 text-lg" onClick={() => onCheckIn('started')}>
              {t('markStarted')}
            </button>
          )}
          {slot.status === 'started' && (
            <button type="button" className="btn-primary min-h-14 flex-1 bg-tide-700 text-lg hover:bg-tide-600" onClick={() => onCheckIn('done')}>
              {t('markDone')}
            </button>
          )}
          {!confirmSkip ? (
            <button type="button" className="btn-quiet min-h-14 flex-1 border-2 border-clay-900 text-lg" onClick={() => setConfirmSkip(true)}>
              {t('markSkipped')}
            </button>
          ) : (
            <div role="group" aria-label={t('confirmSkip')} className="flex w-full flex-col gap-2 rounded-lg bg-amber-50 p-3">
              <p className="font-semibold">{t('confirmSkip')}</p>
              <div className="flex gap-2">
                <button type="button" className="btn-primary min-h-14 flex-1 text-lg" onClick={() => { setConfirmSkip(false); onCheckIn('skipped'); }}>
                  {t('confirmSkipYes')}
                </button>
                <button type="button" className="btn-quiet min-h-14 flex-1 text-lg" onClick={() => setConfirmSkip(false)}>
                  {t('cancel')}
                </button>
              </div>
            </div>
          )}
        </div>
      )}
    </article>
  );
}
