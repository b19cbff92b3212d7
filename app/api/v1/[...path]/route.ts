import { errorResponse } from '@/lib/http/handler';
import { notFound } from '@/lib/http/errors';

/** Unknown API paths answer in the API's own error shape, not with an HTML page. */
const answer = async () => errorResponse(notFound('API path'));

export const GET = answer;
export const POST = answer;
export const PUT = answer;
export const PATCH = answer;
export const DELETE = answer;
