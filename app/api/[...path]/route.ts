import { apiRoute, errorResponse } from '@/lib/api/handler';
import { AppError } from '@/lib/errors';

// Any API path no route claims: the one JSON error shape (404) with the request id and the
// security headers, as every API answer has, rather than the HTML not-found page.
const notFound = apiRoute(async () => errorResponse(new AppError('not_found')));

export const GET = notFound;
export const HEAD = notFound;
export const POST = notFound;
export const PUT = notFound;
export const PATCH = notFound;
export const DELETE = notFound;
export const OPTIONS = notFound;
