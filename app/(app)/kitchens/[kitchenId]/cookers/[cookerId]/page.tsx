import { notFound } from 'next/navigation';
import { CookerDetail } from '@/components/cooker-detail';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { describeCooker, getCooker, listStorageMedia } from '@/lib/cookers';
import { listApiKeys } from '@/lib/cooks/api-keys';
import { HttpError } from '@/lib/http/errors';

export default async function CookerPage({ params }: { params: Promise<{ kitchenId: string; cookerId: string }> }) {
  const { kitchenId, cookerId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  const cooker = await getCooker(access, cookerId).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) notFound();
    throw err;
  });
  // The same answers as GET …/cookers/{cookerId}, …/media and …/cookers/{cookerId}/api-keys (the last two for leads only).
  const [media, apiKeys] = access.canPlan ? await Promise.all([listStorageMedia(access, access.kitchen.organisation.id), listApiKeys(access, cooker.id)]) : [[], []];
  return <CookerDetail kitchenId={kitchenId} cooker={asJson(describeCooker(cooker))} canEdit={access.canPlan} media={asJson(media)} apiKeys={asJson(apiKeys)} />;
}
