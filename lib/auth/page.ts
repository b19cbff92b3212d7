import { cache } from 'react';
import { redirect } from 'next/navigation';
import { requireViewer, type Viewer } from './guard';
import { HttpError } from '@/lib/http/errors';

/**
 * For server-rendered pages: the viewer, or a redirect to sign-in. Cached per request (React cache), so
 * the layouts and the page of one render share one session check and one membership query.
 */
export const getPageViewer = cache(async function getPageViewer(): Promise<Viewer> {
  try {
    return await requireViewer();
  } catch (err) {
    if (err instanceof HttpError && err.status === 401) redirect('/sign-in');
    throw err;
  }
});
