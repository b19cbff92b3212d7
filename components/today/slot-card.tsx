'use client';

import { useFormatter, useTranslations } from '../mini-intl';
import { useState } from 'react';
import type { SlotState } from '@/lib/day/slot-state';
import type { SafetyNote } from '@/lib/safety/notes';
import { SafetyList } from '../safety-list';
import { usePrefs } from '../prefs';
import { LevelIcon } from './icons';
import { duration, type ShownSlot } from './phases';

export type CheckInKind = 'started' | 'done' | 'skipped';

const STATE_STYLE: Record<SlotState, string> = {
  planned: 'bg-clay-100 text-clay-900',
  due: 'bg-amber-100 text-clay-900',
  late: 'bg-ember-50 text-ember-800',
  missed: 'bg-ember-800 text-white',
  cooking: 'bg-amber-100 text-clay-900',
  ready: 'bg-tide-700 text-white',
  done: 'bg-clay-100 text-clay-900',
  skipped: 'bg-clay-100 text-clay-900',
};

/**
 * One slot as a cook needs it next to the cooker: the actions first (big, one tap), then what, where,
 * its state on the clock, when it is hot enough, and the safety notes that are its own (the cooker's
 * shared notes are said once above its slots).
 */
export function SlotCard({ slot, state, ownSafety, nowMs, timeZone, canLog, onCheckIn, emphasis }: {
  slot: ShownSlot;
  state: SlotState;
  ownSafety: SafetyNote[];
  nowMs: number;
  timeZone: string;
  canLog: boolean;
  onCheckIn: (kind: CheckInKind) => void;
  emphasis: 'now' | 'next' | 'later';
}) {
  const t = useTranslations('today');
  const format = useFormatter();
  const { fmtTemp } = usePrefs();
  const [confirmSkip, setConfirmSkip] = useState(false);
  const clock = (ms: number) => format.dateTime(new Date(ms), { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
  const headingId = `slot-${slot.batchId}`;
  const started = slot.status === 'started';

  let readyLine: React.ReactNode = null;
  if (slot.readyMs === null) readyLine = <span className="font-semibold text-ember-800">{t('notReachable', { temp: fmtTemp(slot.minTempC) })}</span>;
  else if (state === 'ready') readyLine = <span className="text-2xl font-bold text-tide-700">{t('readyNow')}</span>;
  else if (started || state === 'planned' || state === 'due')
    readyLine = (
      <>
        <span className="text-2xl font-bold">{t('readyAt', { time: clock(slot.readyMs) })}</span>{' '}
        {started && slot.readyMs > nowMs && (
          <span className="text-lg font-semibold" data-testid="countdown">
            ({t('readyIn', { duration: duration(slot.readyMs - nowMs) })})
          </span>
        )}
      </>
    );
  const lateForServing = slot.readyMs !== null && slot.readyMs > slot.serveByMs && state !== 'missed';

  const border = emphasis === 'now' ? 'border-4 border-ember-600' : emphasis === 'next' ? 'border-2 border-clay-900' : 'border border-clay-200';
  return (
    <article aria-labelledby={headingId} className={`rounded-xl bg-white p-4 shadow-sm ${border}`} data-batch={slot.batchId} data-state={state}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={headingId} className="text-xl font-bold leading-tight">
          {t('slotTitle', { dish: slot.dishName, index: slot.index, of: slot.of })}
        </h3>
        <span className={`rounded-full px-3 py-1 text-sm font-bold ${STATE_STYLE[state]}`} data-testid="slot-state">
          {t(`state.${state}`)}
        </span>
      </div>

      {canLog && (
        <div className="mt-3 flex flex-wrap gap-2">
          {slot.status === 'planned' && (
            <button type="button" className="btn-primary min-h-14 flex-1 text-lg" onClick={() => onCheckIn('started')}>
              {t('markStarted')}
            </button>
          )}
          {started && (
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
                <button
                  type="button"
                  className="btn-primary min-h-14 flex-1 text-lg"
                  onClick={() => {
                    setConfirmSkip(false);
                    onCheckIn('skipped');
                  }}
                >
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

      <p className="mt-2 text-lg">
        {t('servings', { servings: slot.servings })} · {t('potLine', { pot: slot.potName, time: clock(slot.startMs) })}
      </p>
      <p className="mt-1 font-semibold" role="status">
        {state === 'due' && t('stateLine.due', { time: clock(slot.plannedStartMs) })}
        {state === 'late' && t('stateLine.late', { time: clock(slot.plannedStartMs) })}
        {state === 'missed' && t('stateLine.missed', { time: clock(slot.serveByMs) })}
        {started && t('status.started', { time: clock(slot.startedAt ?? slot.startMs) })}
        {slot.pending && ` · ${t('queued')}`}
      </p>
      {readyLine && <p className="mt-1">{readyLine}</p>}
      {lateForServing && (
        <p role="alert" className="mt-2 flex gap-2 rounded-lg bg-ember-50 px-3 py-2 font-semibold text-ember-800">
          <LevelIcon level="danger" />
          <span>{t('readyAfterServeBy', { ready: clock(slot.readyMs!), serveBy: clock(slot.serveByMs) })}</span>
        </p>
      )}
      <p className="text-sm text-clay-700">
        {slot.readySource === 'reading' ? t('fromReading') : t('fromPlan')} · {t('needs', { temp: fmtTemp(slot.minTempC) })}
        {slot.storeAtStartC != null && ` · ${t('storeAtStart', { temp: fmtTemp(slot.storeAtStartC) })}`}
        {slot.potMaxC != null && `, ${t('potMax', { temp: fmtTemp(slot.potMaxC) })}`} · {t('serveBy', { time: clock(slot.serveByMs) })}
      </p>
      <SafetyList notes={ownSafety} />
      <p className="mt-1 text-sm text-clay-700">{t('safetyAbove')}</p>
    </article>
  );
}
