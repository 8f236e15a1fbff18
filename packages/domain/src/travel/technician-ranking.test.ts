import distance from '@turf/distance';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rankTechnicians, type TechnicianCandidate } from './technician-ranking.ts';

const call = { location: { lat: 52.52, lon: 13.405 }, requiredSkills: ['Pinball'] };
const tech = (id: string, lat: number, lon: number, skills: string[], openJobs: number, capacity?: number): TechnicianCandidate => ({
  id,
  location: { lat, lon },
  skills,
  openJobs,
  ...(capacity === undefined ? {} : { capacity }),
});

describe('rankTechnicians', () => {
  it('ranks near, skilled, lightly loaded technicians first and says why', () => {
    const ranks = rankTechnicians(call, [
      tech('far', 52.3, 13.1, ['pinball'], 0),
      tech('near', 52.53, 13.41, ['pinball', 'jukebox'], 1),
      tech('busy', 52.525, 13.405, ['pinball'], 6),
    ]);
    expect(ranks.map((r) => r.id)).toEqual(['near', 'busy', 'far']);
    expect(ranks[0]?.reasons.join('; ')).toMatch(/km away; 1 open job; has every skill needed \(pinball\)/);
  });

  it('distances are haversine km, as @turf/distance gives them', () => {
    const [rank] = rankTechnicians(call, [tech('t', 52.4, 13.2, ['pinball'], 0)]);
    expect(rank?.distanceKm).toBeCloseTo(distance([13.405, 52.52], [13.2, 52.4]), 9);
  });

  it('excludes a technician missing a required skill, or keeps them with a heavy penalty when asked', () => {
    const team = [tech('no-skill', 52.52, 13.405, ['jukebox'], 0), tech('skilled', 52.3, 13.0, ['PINBALL '], 3)];
    const excluded = rankTechnicians(call, team);
    expect(excluded.map((r) => [r.id, r.excluded])).toEqual([
      ['skilled', false],
      ['no-skill', true],
    ]);
    expect(excluded[1]).toMatchObject({ score: 0, missingSkills: ['pinball'] });
    expect(excluded[1]?.reasons).toContain('missing skill: pinball');
    const penalised = rankTechnicians(call, team, { missingSkill: 'penalise' });
    const noSkill = penalised.find((r) => r.id === 'no-skill');
    expect(noSkill?.excluded).toBe(false);
    expect(noSkill?.score).toBeLessThan(25);
  });

  it('counts capacity: a full technician scores no load points', () => {
    const [full] = rankTechnicians({ location: call.location }, [tech('full', 52.52, 13.405, [], 4, 4)], {
      weights: { distance: 0, load: 1, skills: 0 },
    });
    expect(full?.score).toBe(0);
    expect(full?.reasons).toContain('at capacity');
  });

  it('moving closer or shedding open jobs never lowers a score (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.integer({ min: 0, max: 20 }),
        fc.integer({ min: 0, max: 20 }),
        (near, far, fewer, more) => {
          const [a, b] = [Math.min(near, far), Math.max(near, far)];
          const [j1, j2] = [Math.min(fewer, more), Math.max(fewer, more)];
          const score = (offset: number, jobs: number) =>
            rankTechnicians(call, [tech('t', 52.52 + offset, 13.405, ['pinball'], jobs)])[0]?.score ?? NaN;
          expect(score(a, j1)).toBeGreaterThanOrEqual(score(b, j1));
          expect(score(a, j1)).toBeGreaterThanOrEqual(score(a, j2));
        },
      ),
    );
  });

  it('refuses duplicate ids, bad weights and bad locations', () => {
    expect(() => rankTechnicians(call, [tech('a', 52, 13, [], 0), tech('a', 52, 13, [], 0)])).toThrow(
      expect.objectContaining({ code: 'duplicate-id' }),
    );
    expect(() => rankTechnicians(call, [tech('a', 52, 13, [], 0)], { weights: { distance: 0, load: 0, skills: 0 } })).toThrow(
      expect.objectContaining({ field: 'weights' }),
    );
    expect(() => rankTechnicians(call, [tech('a', 95, 13, [], 0)])).toThrow(
      expect.objectContaining({ field: 'technicians[0].location.lat' }),
    );
    expect(() => rankTechnicians(call, [tech('a', 52, 13, [], -1)])).toThrow(expect.objectContaining({ code: 'negative' }));
  });
});
