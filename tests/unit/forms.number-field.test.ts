// components/forms/number-field.ts: the ± button of a number field flips the sign of the typed
// text (phone decimal pads often have no minus key) and leaves the digits as typed.
import { describe, expect, it } from 'vitest';
import { flipSign } from '@/components/forms/number-field';

describe('flipSign', () => {
  // A minus goes onto a positive or empty value and comes off a negative one; the digits stay
  // as typed (a decimal comma stays for the resolver to read).
  it.each([
    ['12.5', '-12.5'],
    ['-12.5', '12.5'],
    ['', '-'],
    ['-', ''],
    [' 3,2 ', '-3,2'],
  ])('%j → %j', (typed, flipped) => {
    expect(flipSign(typed)).toBe(flipped);
  });

  it('flipped twice gives back what was typed', () => {
    expect(flipSign(flipSign('0.05'))).toBe('0.05');
  });
});
