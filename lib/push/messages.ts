import { createTranslator } from 'next-intl';
import type { AlertKind, Locale, TemperatureUnit } from '@/entities';
import en from '@/lib/i18n/messages/en.json';
import fr from '@/lib/i18n/messages/fr.json';
import { formatTemperature } from '@/lib/units';
import type { PushPayload } from './send';

const MESSAGES = { en, fr } as const;

export interface AlertForMessage {
  id: string;
  kind: AlertKind;
  kitchenId: string;
  batchId: string | null;
  cookerId: string | null;
  params: Record<string, string | number>;
}

/** Ready alerts live 15 min in the push service (a late "pot ready" only confuses); lead alerts an hour [s]. */
export const ALERT_TTL_S: Record<AlertKind, number> = { ready: 15 * 60, 'store-low': 60 * 60, 'smoke-point': 30 * 60, skipped: 60 * 60 };

/** "lpg:1.2:kg" → "LPG ≈ 1.2 kg" in the reader's language. */
function fuelWords(encoded: string, name: (fuelId: string) => string, locale: string): string {
  const [fuelId, amount, unit] = encoded.split(':');
  if (!fuelId) return '';
  const known = ['lpg', 'kerosene', 'wood', 'charcoal', 'electricity'].includes(fuelId);
  const n = Number(amount);
  return `${known ? name(fuelId) : fuelId}${Number.isFinite(n) && unit ? ` ≈ ${new Intl.NumberFormat(locale, { maximumFractionDigits: 1 }).format(n)} ${unit}` : ''}`;
}

/** The notification of an alert, worded in the reader's language with temperatures in their unit. */
export function alertPayload(alert: AlertForMessage, reader: { locale: Locale; temperatureUnit: TemperatureUnit }, timeZone: string): PushPayload {
  const locale = reader.locale in MESSAGES ? reader.locale : 'en';
  const t = createTranslator({ locale, messages: MESSAGES[locale], namespace: 'today' });
  const p = alert.params;
  const temp = (key: string) => (typeof p[key] === 'number' ? formatTemperature(p[key] as number, reader.temperatureUnit, locale) : '—');
  const clock = (key: string) => (typeof p[key] === 'number' ? new Intl.DateTimeFormat(locale, { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(p[key] as number)) : '');
  const words = {
    dish: String(p.dish ?? ''),
    cooker: String(p.cooker ?? ''),
    pot: String(p.pot ?? ''),
    index: Number(p.index ?? 1),
    of: Number(p.of ?? 1),
    servings: Number(p.servings ?? 0),
    who: String(p.who ?? ''),
    fuel: fuelWords(String(p.fuel ?? ''), (k) => t(`fuels.${k}` as 'fuels.lpg'), locale),
    minTemp: temp('minTempC'),
    store: temp('storeC'),
    smoke: temp('smokeC'),
    time: clock('atMs'),
    serveBy: clock('serveByMs'),
  };
  const url = `/kitchens/${alert.kitchenId}/today`;
  switch (alert.kind) {
    case 'ready':
      return { kind: 'ready', title: t('push.ready.title', words), body: t('push.ready.body', words), tag: `ready-${alert.batchId}`, url, requireInteraction: true };
    case 'store-low':
      return { kind: 'store-low', title: t('push.storeLow.title', words), body: t('push.storeLow.body', words), tag: `store-low-${alert.batchId}`, url, requireInteraction: true };
    case 'smoke-point':
      return { kind: 'smoke-point', title: t('push.smokePoint.title', words), body: p.measured ? t('push.smokePoint.measured', words) : t('push.smokePoint.predicted', words), tag: `smoke-${alert.cookerId}`, url, requireInteraction: true };
    case 'skipped':
      return { kind: 'skipped', title: t('push.skipped.title', words), body: t('push.skipped.body', words), tag: `skipped-${alert.batchId}`, url };
  }
}
