import { ForecastView, type DayForecast } from '@/components/forecast-view';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { getDayForecast } from '@/lib/forecast/view';
import { addDays } from '@/lib/time';

export default async function ForecastPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  // The same answers as GET …/forecast (today) and …/forecast?date= for the next two days, one after another on the page's unit of work.
  const today = await getDayForecast(access.em, access.kitchen);
  const next = [];
  for (const n of [1, 2]) next.push(await getDayForecast(access.em, access.kitchen, addDays(today.date, n)));
  // lib/forecast/view types the upload mode as a plain string; it is one of UPLOAD_MODES.
  return <ForecastView kitchenId={kitchenId} kitchenName={access.kitchen.name} canUpload={access.canPlan} initialDays={asJson([today, ...next]) as DayForecast[]} />;
}
