import type { Kitchen } from '@/entities';
import type { HourlyWeather } from '@/lib/solar';
import { clearSkyForDay, type WeatherSource } from '@/lib/prediction/predict-day';

export interface KitchenDayWeather {
  hourly: HourlyWeather[];
  source: WeatherSource;
}

export const kitchenSite = (k: Pick<Kitchen, 'latitude' | 'longitude' | 'altitudeM'>) => ({ latitudeDeg: k.latitude, longitudeDeg: k.longitude, altitudeM: k.altitudeM });

/** The hourly weather a kitchen plans a day with (the day before included, for the store's spin-up). */
export async function getPlanningWeather(kitchen: Kitchen, date: string): Promise<KitchenDayWeather> {
  return { hourly: clearSkyForDay(kitchenSite(kitchen), kitchen.timeZone, date), source: 'clear-sky' };
}
