'use client';

import { wipeOfflineData } from '@/lib/offline/store';

// Who the phone's offline copy belongs to. The signed-in layout names the person (from the
// server, or from its own kept copy when there is no signal); until it has, offline reads wait.

const USER_KEY = 'rimeline.offline.user';

let resolveUser: (id: string) => void;
let userReady = new Promise<string>((resolve) => (resolveUser = resolve));
let settled = false;

/**
 * Called by the signed-in layout with the person the page was rendered for. A different person
 * than the one who kept the copy: everything kept before is wiped first.
 */
export async function setOfflineUser(userId: string): Promise<void> {
  const previous = localStorage.getItem(USER_KEY);
  if (previous !== userId) {
    await wipeOfflineData(userId);
    localStorage.setItem(USER_KEY, userId);
  }
  if (settled) userReady = Promise.resolve(userId);
  else resolveUser(userId);
  settled = true;
}

/** The person whose copy this page may read. */
export function offlineUser(): Promise<string> {
  return userReady;
}

/** Sign-out: wipe every kept pack and page, and forget the person. */
export async function signOutWipe(): Promise<void> {
  await wipeOfflineData();
  localStorage.removeItem(USER_KEY);
}
