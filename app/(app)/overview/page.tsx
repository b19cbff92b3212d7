import { notFound } from 'next/navigation';
import { getPageViewer } from '@/lib/auth/page';
import { getVisibleKitchens } from '@/lib/auth/guard';
import { OrganisationOverview } from '@/components/organisation-overview';
import { tomorrowIn } from '@/lib/time';

export default async function OverviewPage() {
  const viewer = await getPageViewer();
  if (!viewer.memberships.some((m) => m.role === 'coordinator')) notFound();
  // Tomorrow in the first kitchen's zone; the page lets the coordinator pick any day.
  const tomorrow = tomorrowIn((await getVisibleKitchens(viewer))[0]?.timeZone ?? 'UTC');
  return <OrganisationOverview initialDate={tomorrow} />;
}
