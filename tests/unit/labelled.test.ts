import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { labelled } from '@/lib/labelled';
import { LEAK_RESULTS, leakResultLabels } from '@/lib/visits/kinds/leak';
import { REQUEST_STATUSES } from '@/lib/requests/schemas';

describe('labelled', () => {
  it('takes the values from the labels, in the order written', () => {
    const { values, labels } = labelled({ zeta: 'Last letter', alpha: 'First letter', mid: 'Between' });
    expect(values).toEqual(['zeta', 'alpha', 'mid']);
    expect(labels.alpha).toBe('First letter');
  });

  it('builds a zod enum that refuses a value outside the list', () => {
    const { values } = labelled({ on: 'On', off: 'Off' });
    const schema = z.enum(values);
    expect(schema.parse('off')).toBe('off');
    expect(schema.safeParse('maybe').success).toBe(false);
  });

  it('refuses an empty list', () => {
    expect(() => labelled({})).toThrow(/at least one value/);
  });

  it('keeps the stored orders the app relied on (entries, requests)', () => {
    expect(LEAK_RESULTS).toEqual(['leak_found', 'no_leak_found', 'passed', 'failed']);
    expect(Object.keys(leakResultLabels)).toEqual([...LEAK_RESULTS]);
    expect(REQUEST_STATUSES).toEqual(['new', 'acknowledged', 'scheduled', 'done', 'declined']);
  });
});
