// The only texts the sign-in page shows for an `?error=` code or a failed sign-in: anything not in
// this table reads as the generic message, so no library or database text ever reaches the page.
export const signInMessages: Record<string, string> = {
  CredentialsSignin: 'The e-mail or password is not right.',
  SignInPaused: 'Too many failed sign-ins. Password sign-in is paused for a while; “E-mail me a link” always works.',
  Verification: 'That sign-in link has expired or was already used. Ask for a new one.',
  AccessDenied: 'This account cannot sign in. Ask your admin.',
  EmailSignin: 'The sign-in link could not be sent. Check the address and try again in a minute.',
  SessionRequired: 'Sign in to continue.',
};

export const GENERIC_SIGN_IN_MESSAGE = 'Sign-in failed. Try again.';

export function signInMessage(code: string | null | undefined): string | undefined {
  if (!code) return undefined;
  return Object.hasOwn(signInMessages, code) ? signInMessages[code] : GENERIC_SIGN_IN_MESSAGE;
}
