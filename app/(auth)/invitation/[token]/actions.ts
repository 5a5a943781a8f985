'use server';

import { redirect } from 'next/navigation';
import { zodIssues } from '@/lib/api/issues';
import { guardAction } from '@/lib/auth/action-guard';
import { isAppError } from '@/lib/errors';
import { acceptInvitationSchema } from '@/lib/users/schemas';
import { acceptInvitation } from '@/lib/users/service';

export interface AcceptState {
  message?: string;
  fieldErrors?: Record<string, string>;
}

// Public by design: the secret token in the e-mailed link is the credential.
export async function acceptInvitationAction(_prev: AcceptState, form: FormData): Promise<AcceptState> {
  try {
    await guardAction(form);
  } catch (error) {
    if (isAppError(error)) return { message: error.message };
    throw error;
  }
  const parsed = acceptInvitationSchema.safeParse({
    token: form.get('token'),
    password: form.get('password'),
    confirm: form.get('confirm'),
  });
  if (!parsed.success) {
    return { message: 'Some fields need attention.', fieldErrors: Object.fromEntries(zodIssues(parsed.error).map((i) => [i.path, i.message])) };
  }
  let email: string;
  try {
    ({ email } = await acceptInvitation(parsed.data));
  } catch (error) {
    if (isAppError(error)) return { message: error.message };
    throw error;
  }
  redirect(`/sign-in?welcome=1&email=${encodeURIComponent(email)}`);
}
