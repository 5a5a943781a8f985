import 'server-only';
import { notFound, redirect } from 'next/navigation';
import { isAppError } from '@/lib/errors';

/** Pages show the not-found page for anything out of the viewer's scope, exactly as the API answers 404. */
export async function orNotFound<T>(promise: Promise<T>): Promise<T> {
  try {
    return await promise;
  } catch (error) {
    if (isAppError(error) && error.code === 'not_found') notFound();
    if (isAppError(error) && error.code === 'forbidden') redirect('/?denied=1');
    throw error;
  }
}
