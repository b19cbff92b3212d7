import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen } from '@/entities';
import type { HourlyWeather } from '@/lib/solar';
import type { WeatherMeta } from '@/lib/prediction/predict-day';
import { getWeatherForDay, kitchenSite, weatherMeta } from '@/lib/forecast';

export { kitchenSite };

export interface KitchenDayWeather {
  hourly: HourlyWeather[];
  meta: WeatherMeta;
  clearness: readonly number[];
}

/** The hourly weather a kitchen plans a day with: the forecast chain of lib/forecast (forecast → stale → upload → clear sky). */
export async function getPlanningWeather(em: EntityManager, kitchen: Kitchen, date: string): Promise<KitchenDayWeather> {
  const w = await getWeatherForDay(em, kitchen, date);
  return { hourly: w.hourly, meta: weatherMeta(w), clearness: w.clearness.values };
}
