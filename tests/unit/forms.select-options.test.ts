// components/forms/select-options.tsx: a select's options from plain or labelled values, in the
// order given, with the label the reader sees.
import { describe, expect, it } from 'vitest';
import { optionsOf } from '@/components/forms/select-options';

describe('optionsOf', () => {
  it('uses each value as its own label when there are no labels (ASHRAE numbers, time zones)', () => {
    expect(optionsOf(['R-404A', 'R-448A'])).toEqual([
      { value: 'R-404A', label: 'R-404A' },
      { value: 'R-448A', label: 'R-448A' },
    ]);
  });

  it('takes the label of each value from the labels given, keeping the values’ order', () => {
    const labels = { open: 'Open', done: 'Done' } as const;
    expect(optionsOf(['done', 'open'] as const, labels)).toEqual([
      { value: 'done', label: 'Done' },
      { value: 'open', label: 'Open' },
    ]);
  });
});
