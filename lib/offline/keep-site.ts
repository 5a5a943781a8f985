'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { FIELD_PAGES, PAGES_CACHE } from '@/lib/offline/cache-names';
import { findUnit, type FoundUnit, type UnitQuery } from '@/lib/offline/lookup';
import { forgetPack, readAllPacks, readPack, savePack, type StoredPack } from '@/lib/offline/store';
import { offlineUser } from '@/lib/offline/user';
import { sitePackSchema } from '@/lib/sites/pack-schema';

// Keeping a site on the phone: fetch its pack while there is signal, store it for the signed-in
// person, and keep the field pages ready so they open without signal.

export type KeepStatus =
  /** Reading what the phone holds. */
  | 'loading'
  /** Not kept on this phone. */
  | 'not_kept'
  /** Fetching a fresh copy. */
  | 'saving'
  /** A complete copy is on the phone. */
  | 'ready'
  /** The last fetch failed; an older copy may still be there. */
  | 'failed';

export interface KeepSiteState {
  status: KeepStatus;
  /** What is on the phone now (null when nothing is). */
  kept: Pick<StoredPack, 'savedAt' | 'sizeBytes'> & { takenAt: string; unitCount: number } | null;
  /** Why the last fetch failed, in words for the person. */
  error: string | null;
  /** Fetch and keep a fresh copy now. */
  keep: () => Promise<void>;
  /** Remove this site's copy from the phone. */
  forget: () => Promise<void>;
}

function summary(stored: StoredPack): KeepSiteState['kept'] {
  return { savedAt: stored.savedAt, sizeBytes: stored.sizeBytes, takenAt: stored.pack.takenAt, unitCount: stored.pack.units.length };
}

/** Puts the field pages in the worker's page cache (network first there too), so they open offline. */
async function warmFieldPages(): Promise<void> {
  if (typeof caches === 'undefined') return;
  const cache = await caches.open(PAGES_CACHE);
  await Promise.all(
    FIELD_PAGES.map(async (path) => {
      const res = await fetch(path, { credentials: 'same-origin', redirect: 'manual' }).catch(() => null);
      // A redirect (signed out) or an error page is never kept.
      if (res && res.ok && res.type === 'basic' && !res.redirected) await cache.put(path, res);
    }),
  );
}

/** Fetches the site's pack and stores it for `userId`; returns what was stored. */
export async function fetchAndKeepSite(userId: string, siteId: string): Promise<StoredPack> {
  const res = await fetch(`/api/sites/${encodeURIComponent(siteId)}/pack`, { credentials: 'same-origin', cache: 'no-store' });
  const text = await res.text();
  if (!res.ok) {
    let message = `The server answered ${res.status}.`;
    try {
      message = (JSON.parse(text) as { error?: { message?: string } }).error?.message ?? message;
    } catch {
      // not JSON: keep the status line
    }
    // The site is no longer this person's to see: its copy goes too.
    if (res.status === 403 || res.status === 404) await forgetPack(userId, siteId);
    throw new Error(message);
  }
  let parsed: ReturnType<typeof sitePackSchema.safeParse>;
  try {
    parsed = sitePackSchema.safeParse(JSON.parse(text));
  } catch {
    parsed = sitePackSchema.safeParse(null);
  }
  // A newer server than this page (or a broken answer): keep the older copy, ask for a reload.
  if (!parsed.success) throw new Error('The server sent a copy this page cannot read. Reload the page.');
  const pack = parsed.data;
  if (pack.viewer.id !== userId) throw new Error('This copy was made for someone else. Reload the page.');
  const stored = await savePack(userId, pack, new TextEncoder().encode(text).byteLength);
  await warmFieldPages().catch(() => undefined);
  return stored;
}

/**
 * Keeps `siteId` on the phone for the signed-in person and refreshes it whenever there is signal
 * (now, when online, and on every `online` event). With `onlyIfKept`, it only refreshes a site
 * already kept and waits for `keep()` otherwise (the site page's button); without it, calling the
 * hook keeps the site (the visit page: starting or continuing a visit keeps its site).
 */
export function useKeepSite(siteId: string, options: { onlyIfKept?: boolean } = {}): KeepSiteState {
  const onlyIfKept = options.onlyIfKept ?? false;
  const [status, setStatus] = useState<KeepStatus>('loading');
  const [kept, setKept] = useState<KeepSiteState['kept']>(null);
  const [error, setError] = useState<string | null>(null);
  const busy = useRef(false);
  const isKept = useRef(false);

  const keep = useCallback(async () => {
    if (busy.current) return;
    busy.current = true;
    setStatus('saving');
    setError(null);
    try {
      const userId = await offlineUser();
      const stored = await fetchAndKeepSite(userId, siteId);
      isKept.current = true;
      setKept(summary(stored));
      setStatus('ready');
    } catch (e) {
      const userId = await offlineUser();
      const still = await readPack(userId, siteId).catch(() => null);
      isKept.current = still !== null;
      setKept(still ? summary(still) : null);
      // fetch rejects with a TypeError (worded per browser) when there is no connection.
      setError(e instanceof TypeError || !(e instanceof Error) ? 'No connection to the server.' : e.message);
      setStatus('failed');
    } finally {
      busy.current = false;
    }
  }, [siteId]);

  const forget = useCallback(async () => {
    await forgetPack(await offlineUser(), siteId);
    isKept.current = false;
    setKept(null);
    setError(null);
    setStatus('not_kept');
  }, [siteId]);

  useEffect(() => {
    let live = true;
    void (async () => {
      const userId = await offlineUser();
      const stored = await readPack(userId, siteId).catch(() => null);
      if (!live) return;
      isKept.current = stored !== null;
      setKept(stored ? summary(stored) : null);
      setStatus(stored ? 'ready' : 'not_kept');
      if (navigator.onLine && (stored || !onlyIfKept)) void keep();
    })();
    const onOnline = () => {
      if (isKept.current || !onlyIfKept) void keep();
    };
    window.addEventListener('online', onOnline);
    return () => {
      live = false;
      window.removeEventListener('online', onOnline);
    };
  }, [siteId, onlyIfKept, keep]);

  return { status, kept, error, keep, forget };
}

/** A unit from the signed-in person's kept packs, by equipment id or by tag code (typed or scanned). */
export async function readKeptUnit(query: UnitQuery): Promise<FoundUnit<StoredPack> | null> {
  const userId = await offlineUser();
  return findUnit(await readAllPacks(userId), query);
}
