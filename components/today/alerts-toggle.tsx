'use client';

import { useTranslations } from '../mini-intl';
import { useEffect, useState } from 'react';

type State = 'unknown' | 'unsupported' | 'denied' | 'off' | 'on' | 'busy';

const b64ToBytes = (b64url: string) => {
  const s = atob(b64url.replace(/-/g, '+').replace(/_/g, '/') + '='.repeat((4 - (b64url.length % 4)) % 4));
  return Uint8Array.from(s, (c) => c.charCodeAt(0));
};
const storageKey = (kitchenId: string) => `hc:push:${kitchenId}`;

/**
 * Turns push alerts on or off for this phone: the browser subscribes with the server's VAPID key and
 * the subscription is saved for this kitchen; off removes it on both sides.
 */
export function AlertsToggle({ kitchenId, vapidPublicKey, online }: { kitchenId: string; vapidPublicKey: string | null; online: boolean }) {
  const t = useTranslations('today');
  const [state, setState] = useState<State>('unknown');
  const [message, setMessage] = useState<string | null>(null);

  useEffect(() => {
    let live = true;
    (async () => {
      if (!('serviceWorker' in navigator) || !('PushManager' in window) || !('Notification' in window)) return live && setState('unsupported');
      if (Notification.permission === 'denied') return live && setState('denied');
      const reg = await navigator.serviceWorker.getRegistration();
      const sub = await reg?.pushManager.getSubscription().catch(() => null);
      const saved = localStorage.getItem(storageKey(kitchenId));
      if (live) setState(sub && saved && JSON.parse(saved).endpoint === sub.endpoint ? 'on' : 'off');
    })().catch(() => live && setState('off'));
    return () => {
      live = false;
    };
  }, [kitchenId]);

  async function turnOn() {
    if (!vapidPublicKey) return;
    setState('busy');
    setMessage(null);
    try {
      if ((await Notification.requestPermission()) !== 'granted') return setState('denied');
      const reg = await navigator.serviceWorker.ready;
      const sub = (await reg.pushManager.getSubscription()) ?? (await reg.pushManager.subscribe({ userVisibleOnly: true, applicationServerKey: b64ToBytes(vapidPublicKey) }));
      const res = await fetch(`/api/v1/kitchens/${kitchenId}/push-subscriptions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(sub.toJSON()) });
      const body = (await res.json().catch(() => null)) as { id?: string; error?: { message: string } } | null;
      if (!res.ok || !body?.id) throw new Error(body?.error?.message ?? `HTTP ${res.status}`);
      localStorage.setItem(storageKey(kitchenId), JSON.stringify({ id: body.id, endpoint: sub.endpoint }));
      setState('on');
    } catch (err) {
      setMessage(t('alertsFailed', { message: err instanceof Error ? err.message : String(err) }));
      setState('off');
    }
  }

  async function turnOff() {
    setState('busy');
    const saved = JSON.parse(localStorage.getItem(storageKey(kitchenId)) ?? 'null') as { id: string } | null;
    const res = saved ? await fetch(`/api/v1/kitchens/${kitchenId}/push-subscriptions/${saved.id}`, { method: 'DELETE' }).catch(() => null) : null;
    const body = (await res?.json().catch(() => null)) as { endpointStillUsed?: boolean } | null;
    // The phone has one push endpoint for all kitchens: keep it while another kitchen's alerts use it.
    if (!body?.endpointStillUsed) {
      const reg = await navigator.serviceWorker.getRegistration();
      await (await reg?.pushManager.getSubscription())?.unsubscribe().catch(() => undefined);
    }
    localStorage.removeItem(storageKey(kitchenId));
    setState('off');
  }

  const text =
    state === 'unsupported' ? t('alertsUnsupported') : state === 'denied' ? t('alertsDenied') : state === 'on' ? t('alertsEnabled') : state === 'off' ? t('alertsDisabled') : '';
  return (
    <section aria-labelledby="alerts-title" className="card flex flex-col gap-2">
      <h2 id="alerts-title" className="text-lg font-bold">{t('alertsTitle')}</h2>
      <p role="status">{text}</p>
      {message && <p role="alert" className="font-semibold text-ember-800">{message}</p>}
      {!online && (state === 'on' || state === 'off') && <p className="text-sm text-clay-700">{t('alertsOffline')}</p>}
      {(state === 'off' || state === 'busy') && (
        <button type="button" className="btn-primary min-h-14 text-lg" disabled={state === 'busy' || !online || !vapidPublicKey} onClick={turnOn}>
          {t('alertsOn')}
        </button>
      )}
      {state === 'on' && (
        <button type="button" className="btn-quiet min-h-14 text-lg" disabled={!online} onClick={turnOff}>
          {t('alertsOff')}
        </button>
      )}
    </section>
  );
}
