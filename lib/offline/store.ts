'use client';

import { deleteDB, openDB, type DBSchema, type IDBPDatabase } from 'idb';
import { PAGES_CACHE } from '@/lib/offline/cache-names';
import type { SitePack } from '@/lib/sites/pack-schema';
import { SITE_PACK_VERSION } from '@/lib/sites/pack-version';

// Kept site packs in IndexedDB: one database per signed-in person, so one person's copy can never
// answer another's lookups, and a whole person's copy goes at once on sign-out.

export interface StoredPack {
  siteId: string;
  userId: string;
  /** When the phone saved it (device clock). */
  savedAt: string;
  /** Bytes of the pack as it came over the network. */
  sizeBytes: number;
  pack: SitePack;
}

interface PackDb extends DBSchema {
  packs: { key: string; value: StoredPack };
}

const DB_PREFIX = 'rimeline-offline-';
/** Fallback list of people with a database here, for browsers without indexedDB.databases(). */
const USERS_KEY = 'rimeline.offline.users';

export const packDbName = (userId: string) => `${DB_PREFIX}${userId}`;

const connections = new Map<string, Promise<IDBPDatabase<PackDb>>>();

function knownUsers(): string[] {
  try {
    const list = JSON.parse(localStorage.getItem(USERS_KEY) ?? '[]');
    return Array.isArray(list) ? list.filter((v): v is string => typeof v === 'string') : [];
  } catch {
    return [];
  }
}

function openPackDb(userId: string): Promise<IDBPDatabase<PackDb>> {
  let db = connections.get(userId);
  if (!db) {
    const users = knownUsers();
    if (!users.includes(userId)) localStorage.setItem(USERS_KEY, JSON.stringify([...users, userId]));
    db = openDB<PackDb>(packDbName(userId), 1, {
      upgrade(database) {
        database.createObjectStore('packs', { keyPath: 'siteId' });
      },
      // Another tab deletes this database (sign-out there): let go so the deletion goes through.
      blocking() {
        void db?.then((d) => d.close());
        connections.delete(userId);
      },
      terminated() {
        connections.delete(userId);
      },
    });
    connections.set(userId, db);
  }
  return db;
}

export async function savePack(userId: string, pack: SitePack, sizeBytes: number): Promise<StoredPack> {
  const stored: StoredPack = { siteId: pack.site.id, userId, savedAt: new Date().toISOString(), sizeBytes, pack };
  await (await openPackDb(userId)).put('packs', stored);
  return stored;
}

export async function readPack(userId: string, siteId: string): Promise<StoredPack | null> {
  const stored = await (await openPackDb(userId)).get('packs', siteId);
  return stored && stored.userId === userId && stored.pack.version === SITE_PACK_VERSION ? stored : null;
}

export async function readAllPacks(userId: string): Promise<StoredPack[]> {
  const all = await (await openPackDb(userId)).getAll('packs');
  return all.filter((p) => p.userId === userId && p.pack.version === SITE_PACK_VERSION);
}

export async function forgetPack(userId: string, siteId: string): Promise<void> {
  await (await openPackDb(userId)).delete('packs', siteId);
}

/** Every person's packs and the kept pages, gone (sign-out, a change of user). */
export async function wipeOfflineData(keepUserId?: string): Promise<void> {
  const names = new Set(knownUsers().map(packDbName));
  if (typeof indexedDB.databases === 'function') {
    for (const info of await indexedDB.databases()) if (info.name?.startsWith(DB_PREFIX)) names.add(info.name);
  }
  if (keepUserId) names.delete(packDbName(keepUserId));
  for (const [userId, db] of connections) {
    if (userId === keepUserId) continue;
    (await db.catch(() => null))?.close();
    connections.delete(userId);
  }
  await Promise.all([...names].map((name) => deleteDB(name)));
  localStorage.setItem(USERS_KEY, JSON.stringify(keepUserId ? [keepUserId] : []));
  if (typeof caches !== 'undefined') await caches.delete(PAGES_CACHE);
}
