'use server';

import { requireActor } from '@/lib/auth';
import { guardAction } from '@/lib/auth/action-guard';
import { endAllSessions } from '@/lib/auth/sessions';
import { isAppError } from '@/lib/errors';

export interface EndSessionsState {
  ok: boolean;
  message: string;
}

/** "Sign out everywhere": for oneself, or (admins) for a person of the company. */
export async function endSessionsAction(userId: string): Promise<EndSessionsState> {
  try {
    await guardAction();
    const actor = await requireActor();
    const ended = await endAllSessions(actor, userId);
    return { ok: true, message: ended === 1 ? 'Signed out of 1 session.' : `Signed out of ${ended} sessions.` };
  } catch (error) {
    if (isAppError(error)) return { ok: false, message: error.message };
    throw error;
  }
}
