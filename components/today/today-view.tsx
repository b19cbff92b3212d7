'use client';

import { useFormatter, useTranslations } from '../mini-intl';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { TodayCooker, TodayPageData, TodayWarning } from '@/lib/cooks/today';
import { deleteEntry, flushOutbox, keepSending, listEntries, newEntry, putEntry, type OutboxEntry } from '@/lib/client/outbox';
import { usePrefs } from '../prefs';
import { AlertsToggle } from './alerts-toggle';
import { SafetyList } from '../safety-list';
import { LevelIcon } from './icons';
import { LanguageChoice } from './language-choice';
import { phases, shareNotes, withPending } from './phases';
import { ReadingForm } from './reading-form';
import { SlotCard, type CheckInKind } from './slot-card';

const cacheKey = (kitchenId: string) => `hc:today:${kitchenId}`;

/** Registers the service worker and hands it what this page loaded before it was in control (so a reload works offline). */
async function registerServiceWorker(kitchenId: string) {
  if (!('serviceWorker' in navigator)) return;
  await navigator.serviceWorker.register('/sw.js', { scope: '/' });
  const reg = await navigator.serviceWorker.ready;
  const urls = [location.href, `/api/v1/kitchens/${kitchenId}/today`, ...performance.getEntriesByType('resource').map((e) => e.name)];
  reg.active?.postMessage({ type: 'cache-urls', urls });
}

/**
 * The cooks' page: today's published slots per cooker with their state on the clock, countdowns and
 * safety notes, check-ins and readings that survive a lost connection (outbox), push alerts on or off,
 * and tomorrow's plan. The server renders the first data (`initial`); the page refreshes it, works from
 * the service worker's copy when offline and says when it last synced.
 */
export function TodayView({ kitchenId, userId, timeZone, initial, locale }: { kitchenId: string; userId: string; timeZone: string; initial: TodayPageData | null; locale: string }) {
  const t = useTranslations('today');
  const format = useFormatter();
  const { fmtTemp } = usePrefs();
  const [data, setData] = useState<TodayPageData | null>(initial);
  const [synced, setSynced] = useState<{ at: number; fromCache: boolean } | null>(initial ? { at: initial.serverNowMs, fromCache: false } : null);
  const [online, setOnline] = useState(true);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [outbox, setOutbox] = useState<OutboxEntry[]>([]);
  const [nowMs, setNowMs] = useState(() => Date.now());
  const [notice, setNotice] = useState<string | null>(null);
  const live = useRef(true);

  const clock = useCallback((ms: number) => format.dateTime(new Date(ms), { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }), [format, timeZone]);

  const load = useCallback(async () => {
    try {
      const res = await fetch(`/api/v1/kitchens/${kitchenId}/today`, { credentials: 'same-origin' });
      if (res.ok) {
        const body = (await res.json()) as TodayPageData;
        const fromCache = res.headers.get('x-hc-from-cache') === '1';
        const at = fromCache ? Number(res.headers.get('x-hc-cached-at') ?? Date.now()) : Date.now();
        if (!live.current) return;
        setData(body);
        setSynced({ at, fromCache });
        setOnline(!fromCache);
        setLoadError(null);
        if (!fromCache) localStorage.setItem(cacheKey(kitchenId), JSON.stringify({ at, data: body }));
        return;
      }
      const err = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
      if (live.current) setLoadError(err?.error?.message ?? `HTTP ${res.status}`);
    } catch {
      // No network and no service-worker copy: the phone's own last copy.
      const saved = JSON.parse(localStorage.getItem(cacheKey(kitchenId)) ?? 'null') as { at: number; data: TodayPageData } | null;
      if (!live.current) return;
      setOnline(false);
      if (saved) {
        setData((d) => d ?? saved.data);
        setSynced((s) => s ?? { at: saved.at, fromCache: true });
      }
    }
  }, [kitchenId]);

  const refreshOutbox = useCallback(async () => {
    const list = await listEntries(kitchenId, userId).catch(() => []);
    if (live.current) setOutbox(list);
    return list;
  }, [kitchenId, userId]);

  const flush = useCallback(async () => {
    const r = await flushOutbox(kitchenId, userId).catch(() => ({ sent: 0, stopped: 'offline' as const }));
    const left = await refreshOutbox();
    if (r.sent > 0) {
      if (live.current && !left.some((e) => e.state === 'pending')) setNotice(t('allSent'));
      await load();
    }
    return r;
  }, [kitchenId, userId, refreshOutbox, load, t]);

  useEffect(() => {
    live.current = true;
    // Started from a promise callback: the effect itself only subscribes (react-hooks/set-state-in-effect).
    void Promise.resolve().then(load).then(flush);
    registerServiceWorker(kitchenId).catch(() => undefined);
    const goOnline = () => {
      setOnline(true);
      flush().then(() => load());
    };
    const goOffline = () => setOnline(false);
    window.addEventListener('online', goOnline);
    window.addEventListener('offline', goOffline);
    const tick = setInterval(() => setNowMs(Date.now()), 15_000);
    const poll = setInterval(() => {
      if (document.visibilityState === 'visible' && navigator.onLine) flush().then(() => load());
    }, 60_000);
    return () => {
      live.current = false;
      window.removeEventListener('online', goOnline);
      window.removeEventListener('offline', goOffline);
      clearInterval(tick);
      clearInterval(poll);
    };
  }, [kitchenId, load, flush]);

  useEffect(() => keepSending(flush), [flush]);

  /** Every entry goes to the outbox first, then out; offline it simply waits there. */
  const submit = useCallback(
    async (kind: 'check-in' | 'reading', body: Record<string, unknown>) => {
      const url = kind === 'check-in' ? `/api/v1/kitchens/${kitchenId}/check-ins` : `/api/v1/kitchens/${kitchenId}/readings`;
      const entry = newEntry({ userId, kitchenId, kind, url, body });
      await putEntry(entry);
      await refreshOutbox();
      const r = await flush();
      if (live.current) setNotice(r.stopped === 'offline' || r.stopped === 'server' ? t('queued') : t('sent'));
    },
    [kitchenId, userId, refreshOutbox, flush, t],
  );

  const checkIn = useCallback(
    (batchId: string, kind: CheckInKind) => {
      if (!data?.plan) return;
      void submit('check-in', { planId: data.plan.id, batchId, kind, at: new Date().toISOString() });
    },
    [data, submit],
  );

  const pending = outbox.filter((e) => e.state === 'pending');
  const rejected = outbox.filter((e) => e.state === 'rejected');

  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4 text-clay-900">
      <header className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h1 className="text-3xl font-bold">{t('title')}</h1>
          {data?.plan && <p className="text-lg">{t('dateLine', { date: format.dateTime(new Date(`${data.date}T12:00:00Z`), { dateStyle: 'full', timeZone: 'UTC' }), version: data.plan.version })}</p>}
        </div>
        <LanguageChoice locale={locale} />
      </header>

      <SyncBar online={online} synced={synced} pending={pending.length} clock={clock} onRefresh={() => flush().then(() => load())} />
      {notice && (
        <p role="status" className="rounded-lg bg-tide-50 px-3 py-2 font-semibold text-tide-700">
          {notice}
        </p>
      )}
      {rejected.map((e) => (
        <div key={e.id} role="alert" className="flex items-start justify-between gap-2 rounded-lg bg-ember-50 px-3 py-2 text-ember-800">
          <span className="font-semibold">{t('rejected', { message: e.error ?? '' })}</span>
          <button type="button" className="btn-quiet" onClick={() => deleteEntry(e.id).then(refreshOutbox)}>
            {t('dismiss')}
          </button>
        </div>
      ))}
      {loadError && (
        <p role="alert" className="rounded-lg bg-ember-50 px-3 py-2 font-semibold text-ember-800">
          {loadError}
        </p>
      )}
      {!data && !loadError && <p aria-busy="true">{t('loading')}</p>}

      {data && <Warnings warnings={data.warnings} cookers={data.cookers} clock={clock} fmtTemp={fmtTemp} />}
      {data && <AlertsToggle kitchenId={kitchenId} vapidPublicKey={data.vapidPublicKey} online={online} />}

      {data && !data.plan && (
        <p className="card text-lg" data-testid="no-plan">
          {t('noPlan')}
        </p>
      )}
      {data?.plan && (
        <p className="card text-lg" data-testid="day-summary">
          {data.cookers.some((c) => c.slots.length) ? t('summary', { sun: data.servings.onSun, backup: data.servings.backup }) : t('allOnBackup', { backup: data.servings.backup })}
        </p>
      )}

      {data?.plan &&
        data.cookers.map((c) => (
          <CookerSection key={c.id} cooker={c} outbox={outbox} nowMs={nowMs} timeZone={timeZone} canLog={data.canLog} clock={clock} onCheckIn={checkIn} onReading={(body) => submit('reading', body)} />
        ))}

      {data && data.backup.length > 0 && <BackupList backup={data.backup} title={t('backupTitle')} />}
      {data && <Tomorrow data={data} clock={clock} />}
    </div>
  );
}

function SyncBar({ online, synced, pending, clock, onRefresh }: { online: boolean; synced: { at: number; fromCache: boolean } | null; pending: number; clock: (ms: number) => string; onRefresh: () => void }) {
  const t = useTranslations('today');
  return (
    <div className={`flex flex-wrap items-center gap-2 rounded-lg px-3 py-2 ${online ? 'bg-clay-100' : 'bg-amber-100 text-clay-900'}`} data-testid="sync-bar">
      <p role="status" className="flex-1 font-semibold">
        {!online && synced ? t('offline', { time: clock(synced.at) }) : synced ? t('lastSynced', { time: clock(synced.at) }) : ''}
        {pending > 0 && <span className="block">{t('pending', { count: pending })}</span>}
      </p>
      <button type="button" className="btn-quiet min-h-12" onClick={onRefresh}>
        {t('refresh')}
      </button>
    </div>
  );
}

function Warnings({ warnings, cookers, clock, fmtTemp }: { warnings: TodayWarning[]; cookers: TodayCooker[]; clock: (ms: number) => string; fmtTemp: (c: number | null | undefined) => string }) {
  const t = useTranslations('today');
  if (!warnings.length) return null;
  const name = (id: string) => cookers.find((c) => c.id === id)?.name ?? '';
  return (
    <section aria-label={t('warnings')} className="flex flex-col gap-2">
      {warnings.map((w, i) => (
        <p key={i} role="alert" className="flex gap-2 rounded-lg border-2 border-ember-800 bg-ember-50 px-3 py-2 text-lg font-semibold text-ember-800">
          <LevelIcon level="danger" className="mt-1 h-5 w-5 shrink-0" />
          <span>
            {w.kind === 'store-low'
              ? t('storeLow', { cooker: name(w.cookerId), dish: w.dishName, temp: fmtTemp(w.neededC) })
              : w.kind === 'ready-after-serve-by'
                ? t('warnReadyAfterServeBy', { cooker: name(w.cookerId), dish: w.dishName, ready: clock(w.readyMs), serveBy: clock(w.serveByMs) })
                : w.measured
                  ? t('smokeMeasured', { cooker: name(w.cookerId), temp: fmtTemp(w.storeC), smoke: fmtTemp(w.smokeC) })
                  : t('smokePredicted', { cooker: name(w.cookerId), temp: fmtTemp(w.storeC), smoke: fmtTemp(w.smokeC), time: clock(w.atMs) })}
          </span>
        </p>
      ))}
    </section>
  );
}

function CookerSection({ cooker, outbox, nowMs, timeZone, canLog, clock, onCheckIn, onReading }: {
  cooker: TodayCooker;
  outbox: OutboxEntry[];
  nowMs: number;
  timeZone: string;
  canLog: boolean;
  clock: (ms: number) => string;
  onCheckIn: (batchId: string, kind: CheckInKind) => void;
  onReading: (body: Record<string, unknown>) => Promise<void>;
}) {
  const t = useTranslations('today');
  const tStatus = useTranslations('today.status');
  const { fmtTemp } = usePrefs();
  const slots = useMemo(() => withPending(cooker.slots, outbox), [cooker.slots, outbox]);
  const p = phases(slots, nowMs);
  const notes = useMemo(() => shareNotes(cooker.slots), [cooker.slots]);
  const r = cooker.latestReading;
  const headingId = `cooker-${cooker.id}`;
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-3 rounded-2xl border-2 border-clay-200 bg-clay-50 p-3">
      <div>
        <h2 id={headingId} className="text-2xl font-bold">{cooker.name}</h2>
        <p className="text-base">
          {cooker.mediumName && `${cooker.mediumName} · `}
          <span className="font-semibold">
            {cooker.repredictedFromMs !== null ? t('storeNowRepredicted', { temp: fmtTemp(cooker.storeNowC), time: clock(r?.atMs ?? cooker.repredictedFromMs) }) : t('storeNow', { temp: fmtTemp(cooker.storeNowC) })}
          </span>
        </p>
        {r && <p className="text-sm text-clay-700">{t('lastReading', { time: clock(r.atMs), store: fmtTemp(r.storeC), pot: fmtTemp(r.potC) })}</p>}
      </div>
      {notes.shared.length > 0 && (
        <div className="rounded-lg bg-white px-3 py-2" data-testid="cooker-safety">
          <h3 className="font-semibold">{t('safetyTitle')}</h3>
          {/* The dangers stay in sight; the rest of this cooker's notes are one tap away. */}
          <SafetyList notes={notes.shared.filter((n) => n.level === 'danger')} />
          <details>
            <summary className="min-h-12 cursor-pointer content-center font-semibold underline underline-offset-4">{t('safetyMore', { count: notes.shared.filter((n) => n.level !== 'danger').length })}</summary>
            <SafetyList notes={notes.shared.filter((n) => n.level !== 'danger')} />
          </details>
        </div>
      )}

      {slots.length === 0 ? <p className="text-base text-clay-700">{t('noSlotsHere')}</p> : p.current.length === 0 && <p className="text-base text-clay-700">{t('nothingNow')}</p>}
      {p.current.map((s) => (
        <div key={s.batchId}>
          <p className="mb-1 text-sm font-bold uppercase tracking-wide text-ember-700">{t('now')}</p>
          <SlotCard slot={s} state={s.state} ownSafety={notes.own(s)} nowMs={nowMs} timeZone={timeZone} canLog={canLog} onCheckIn={(k) => onCheckIn(s.batchId, k)} emphasis="now" />
        </div>
      ))}
      {p.next.map((s) => (
        <div key={s.batchId}>
          <p className="mb-1 text-sm font-bold uppercase tracking-wide">{t('next')}</p>
          <SlotCard slot={s} state={s.state} ownSafety={notes.own(s)} nowMs={nowMs} timeZone={timeZone} canLog={canLog} onCheckIn={(k) => onCheckIn(s.batchId, k)} emphasis="next" />
        </div>
      ))}
      {p.later.length > 0 && <p className="text-sm font-bold uppercase tracking-wide">{t('later')}</p>}
      {p.later.map((s) => (
        <SlotCard key={s.batchId} slot={s} state={s.state} ownSafety={notes.own(s)} nowMs={nowMs} timeZone={timeZone} canLog={canLog} onCheckIn={(k) => onCheckIn(s.batchId, k)} emphasis="later" />
      ))}

      {canLog && <ReadingForm cookerId={cooker.id} pots={cooker.pots} defaultPotId={p.current[0]?.potId ?? p.next[0]?.potId ?? null} onSubmit={onReading} />}

      {p.finished.length > 0 && (
        <div>
          <p className="text-sm font-bold uppercase tracking-wide">{t('finished')}</p>
          <ul className="flex flex-col gap-1">
            {p.finished.map((s) => (
              <li key={s.batchId} className="rounded-lg bg-white px-3 py-2" data-batch={s.batchId}>
                <span className="font-semibold">{t('slotTitle', { dish: s.dishName, index: s.index, of: s.of })}</span> ·{' '}
                {s.status === 'done' ? tStatus('done', { time: clock(s.doneAt ?? nowMs) }) : tStatus('skipped', { time: clock(s.skippedAt ?? nowMs) })}
                {s.pending && ` · ${t('queued')}`}
              </li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}

function BackupList({ backup, title }: { backup: TodayPageData['backup']; title: string }) {
  const t = useTranslations('today');
  const tr = useTranslations('plan.reasons');
  const format = useFormatter();
  return (
    <section aria-label={title} className="card flex flex-col gap-2">
      <h2 className="text-xl font-bold">{title}</h2>
      <ul className="flex flex-col gap-2">
        {backup.map((b) => (
          <li key={b.batchId} className="rounded-lg bg-clay-100 px-3 py-2">
            <span className="font-semibold">{t('backupRow', { dish: b.dishName, index: b.index, of: b.of, servings: b.servings })}</span>
            <span className="block text-sm">
              {b.reason === 'skipped' ? t('backupSkipped') : tr(b.reason as 'no-free-pot')}
              {b.fuelId && b.amount !== null && ` · ${t('backupFuel', { fuel: ['lpg', 'kerosene', 'wood', 'charcoal', 'electricity'].includes(b.fuelId) ? t(`fuels.${b.fuelId}` as 'fuels.lpg') : b.fuelId, amount: format.number(b.amount, { maximumFractionDigits: 1 }), unit: b.unit ?? '' })}`}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** Tomorrow's published plan, for the evening's preparations (soak the beans, fill the water). */
function Tomorrow({ data, clock }: { data: TodayPageData; clock: (ms: number) => string }) {
  const t = useTranslations('today');
  const format = useFormatter();
  const d = data.tomorrow;
  const date = (day: string) => format.dateTime(new Date(`${day}T12:00:00Z`), { weekday: 'long', day: 'numeric', month: 'long', timeZone: 'UTC' });
  if (!d || !d.plan) return <p className="text-base text-clay-700">{t('tomorrowNone')}</p>;
  const slots = d.cookers.flatMap((c) => c.slots.map((s) => ({ ...s, cooker: c.name }))).sort((a, b) => a.startMs - b.startMs);
  return (
    <section aria-labelledby="tomorrow-title" className="card flex flex-col gap-2">
      <h2 id="tomorrow-title" className="text-xl font-bold">{t('tomorrowTitle', { date: date(d.date) })}</h2>
      <p>{t('summary', { sun: d.servings.onSun, backup: d.servings.backup })}</p>
      <ul className="flex flex-col gap-1">
        {slots.map((s) => (
          <li key={s.batchId} className="rounded-lg bg-clay-100 px-3 py-2">
            <span className="font-semibold">{clock(s.startMs)}</span> · {t('slotTitle', { dish: s.dishName, index: s.index, of: s.of })} · {s.cooker}, {s.potName}
          </li>
        ))}
      </ul>
      {d.backup.length > 0 && <BackupList backup={d.backup} title={t('backupTitle')} />}
    </section>
  );
}
