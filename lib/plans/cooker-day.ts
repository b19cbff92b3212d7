import type { EntityManager } from '@mikro-orm/postgresql';
import type { Cooker, Kitchen } from '@/entities';
import { toApertureGeometry, toCookerSpec } from '@/lib/cookers/spec';
import { getWeatherForDay, kitchenSite, weatherMeta } from '@/lib/forecast/weather-for-day';
import { predictDay } from '@/lib/prediction/predict-day';

/**
 * A cooker's predicted day on the weather the fallback chain picks (forecast, stale forecast, upload or clear
 * sky × the kitchen's monthly clear-sky index; lib/forecast getWeatherForDay), with its source and age.
 */
export async function predictCookerDay(em: EntityManager, kitchen: Kitchen, cooker: Cooker, date: string, initialStoreTempC?: number) {
  const weather = await getWeatherForDay(em, kitchen, date);
  return predictDay({
    site: kitchenSite(kitchen),
    timeZone: kitchen.timeZone,
    date,
    spec: toCookerSpec(cooker, cooker.customMedium),
    geometry: toApertureGeometry(cooker),
    hourly: weather.hourly,
    weather: weatherMeta(weather),
    clearness: weather.clearness.values,
    ...(initialStoreTempC !== undefined ? { initialStoreTempC } : {}),
  });
}

