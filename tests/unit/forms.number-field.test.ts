// components/forms/number-field.ts: the ± button of a number field flips the sign of the typed
// text (phone decimal pads often have no minus key) and leaves the digits as typed.
import { describe, expect, it } from 'vitest';
import { flipSign } from '@/components/forms/number-field';

describe('flipSign', () => {
  it('adds a minus to a positive or empty value and takes it off a negative one', () => {
    expect(flipSign('12.5')).toBe('-12.5');
    expect(flipSign('-12.5')).toBe('12.5');
    expect(flipSign('')).toBe('-');
    expect(flipSign('-')).toBe('');
  });

  it('keeps the digits as typed (a decimal comma stays for the resolver to read)', () => {
    expect(flipSign(' 3,2 ')).toBe('-3,2');
    expect(flipSign(flipSign('0.05'))).toBe('0.05');
  });
});
