import { describe, expect, it } from 'vitest';
import { directionsUrl } from './maps-link.ts';

describe('directionsUrl', () => {
  it('builds the Maps URLs directions form with the destination as lat,lng (Google Maps URLs, Directions action)', () => {
    const url = new URL(directionsUrl({ lat: 41.878113, lon: -87.629799 }));
    expect(url.origin + url.pathname).toBe('https://www.google.com/maps/dir/');
    expect(url.searchParams.get('api')).toBe('1');
    expect(url.searchParams.get('destination')).toBe('41.878113,-87.629799');
    expect(url.searchParams.get('travelmode')).toBe('driving');
  });

  it('rounds to six decimals and refuses a point off the globe', () => {
    expect(new URL(directionsUrl({ lat: 1.23456789, lon: 2 })).searchParams.get('destination')).toBe('1.234568,2.000000');
    expect(() => directionsUrl({ lat: 91, lon: 0 })).toThrow(/lat/);
  });
});
