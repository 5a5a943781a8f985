import type { SiteSummary } from '@/lib/overview/service';

// The owner home shows the sites whose open items are most pressing as full cards and the rest as
// one line each: an owner with fifty sites reads the few that need them first, and the page stays
// a glance (fifty full cards were over half a megabyte of markup).

/**
 * Full cards on the owner home: about two phone screens of them. The other sites get a line each,
 * and the sites page lists them all.
 */
export const HOME_SITE_CARDS = 6;

// Most pressing first, compared in this order (a safety item outranks any number of lesser ones):
// the same severity order as the follow-ups, then leaks, then the units' own state.
const needKeys: readonly ((s: SiteSummary) => number)[] = [
  (s) => s.openFollowUps.safety,
  (s) => s.openFollowUps.down,
  (s) => s.systemsOverLeakThreshold,
  (s) => s.openFollowUps.degraded,
  (s) => s.byCondition[1],
  (s) => s.byCondition[2],
  (s) => s.pastExpectedLife,
  (s) => s.openFollowUps.minor,
];

/** Sort order for site summaries: most pressing open items first, then by name. */
export function bySiteNeed(a: SiteSummary, b: SiteSummary): number {
  for (const key of needKeys) {
    const d = key(b) - key(a);
    if (d !== 0) return d;
  }
  return a.siteName.localeCompare(b.siteName) || a.siteId.localeCompare(b.siteId);
}

/** The sites shown as cards, most pressing first, and the rest in the same order. */
export function sitesForHome(summaries: readonly SiteSummary[], cards = HOME_SITE_CARDS): { cards: SiteSummary[]; rest: SiteSummary[] } {
  const ordered = [...summaries].sort(bySiteNeed);
  return { cards: ordered.slice(0, cards), rest: ordered.slice(cards) };
}

/** Open follow-ups of every severity at a site. */
export function openFollowUpTotal(s: SiteSummary): number {
  return s.openFollowUps.safety + s.openFollowUps.down + s.openFollowUps.degraded + s.openFollowUps.minor;
}
