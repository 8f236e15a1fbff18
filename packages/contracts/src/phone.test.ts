import { describe, expect, it } from 'vitest';
import { maskAddress, phoneNumber } from './phone.ts';

describe('phoneNumber', () => {
  // Check values: NANP numbering (area code 312 is Chicago; 555-01xx is reserved for fiction, common practice).
  it('normalises US and international forms to E.164', () => {
    expect(phoneNumber.parse('(312) 555-0142')).toBe('+13125550142');
    expect(phoneNumber.parse('+44 20 7946 0958')).toBe('+442079460958');
  });
  it('refuses what is not a phone number', () => {
    expect(phoneNumber.safeParse('12').success).toBe(false);
    expect(phoneNumber.safeParse('call me maybe').success).toBe(false);
    expect(phoneNumber.safeParse('<script>alert(1)</script>').success).toBe(false);
  });
});

describe('maskAddress', () => {
  it('keeps only the last two digits of a number and the first letter and domain of an e-mail', () => {
    expect(maskAddress('+13125550142')).toBe('•••• 42');
    expect(maskAddress('hollis@venue.example')).toBe('h•••@venue.example');
    expect(maskAddress('+13125550142')).not.toContain('555');
  });
});
