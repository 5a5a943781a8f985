// Where a leak over the threshold stands after the refrigerant addition that revealed it: not yet
// repaired, repaired but not yet verified, or repaired and verified. 40 CFR 82.157(d)–(e) asks for
// the repair and then an initial and a follow-up verification test; once both have passed after
// the repair, the exceedance no longer needs anyone's attention. Pure; the service supplies the
// system's leak work.

export interface LeakWorkItem {
  /** ISO date-time the entry was recorded. */
  at: string;
  visitId: string;
  activity: 'inspection' | 'repair' | 'initial_verification' | 'follow_up_verification';
  result: 'leak_found' | 'no_leak_found' | 'passed' | 'failed' | null;
}

export type LeakFollowThrough =
  | { state: 'unrepaired' }
  | { state: 'repaired'; repairedOn: string; failedTest: boolean }
  | { state: 'verified'; repairedOn: string; verifiedOn: string };

/**
 * `addition` is the refrigerant entry whose leak rate was over the threshold. Leak work counts
 * when recorded after it, or on the same visit (a repair is often made before the top-up).
 */
export function leakFollowThrough(addition: { at: string; visitId: string }, work: readonly LeakWorkItem[]): LeakFollowThrough {
  const relevant = work.filter((w) => w.at >= addition.at || w.visitId === addition.visitId).sort((a, b) => a.at.localeCompare(b.at));
  const repair = relevant.filter((w) => w.activity === 'repair').at(-1);
  if (!repair) return { state: 'unrepaired' };
  const repairedOn = repair.at.slice(0, 10);
  const tests = relevant.filter((w) => w.at >= repair.at && (w.activity === 'initial_verification' || w.activity === 'follow_up_verification'));
  // A failed test after the last repair means that repair did not hold: another one is needed.
  if (tests.some((t) => t.result === 'failed')) return { state: 'repaired', repairedOn, failedTest: true };
  const initial = tests.find((t) => t.activity === 'initial_verification' && t.result === 'passed');
  const followUp = initial && tests.find((t) => t.activity === 'follow_up_verification' && t.result === 'passed' && t.at >= initial.at);
  if (followUp) return { state: 'verified', repairedOn, verifiedOn: followUp.at.slice(0, 10) };
  return { state: 'repaired', repairedOn, failedTest: false };
}
