'use client';

// The phone's offline copy, for client components: keep a site, read a unit from kept sites.
export { useKeepSite, readKeptUnit, fetchAndKeepSite, type KeepSiteState, type KeepStatus } from '@/lib/offline/keep-site';
export { findUnit, type UnitQuery, type FoundUnit } from '@/lib/offline/lookup';
export { readAllPacks, readPack, type StoredPack } from '@/lib/offline/store';
export { offlineUser, setOfflineUser, signOutWipe } from '@/lib/offline/user';
export { openTagCode } from '@/lib/offline/open-unit';
