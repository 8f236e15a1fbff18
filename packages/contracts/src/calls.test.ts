import { describe, expect, it } from 'vitest';
import { callStateGroups, callStates, inStateGroup, transitions, type CallState } from './calls.ts';

/** States reachable from `from` by transitions (assignment counts as reported → assigned). */
function reachable(from: CallState): Set<CallState> {
  const seen = new Set<CallState>([from]);
  const next = (s: CallState) => (s === 'reported' ? [...transitions[s], 'assigned' as const] : transitions[s]);
  for (const s of seen) for (const n of next(s)) seen.add(n);
  return seen;
}

describe('call state groups', () => {
  it('open and unfixed are what the dispatch list and the game status have always used', () => {
    expect(callStateGroups.open).toEqual(['reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed']);
    expect(callStateGroups.unfixed).toEqual(['reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop']);
  });

  it('follow from the transition table', () => {
    for (const s of callStateGroups.unfixed) expect(reachable(s).has('fixed'), s).toBe(true);
    for (const s of callStateGroups.awaitingArrival) expect(reachable(s).has('on_site'), s).toBe(true);
    // Once on site, nobody is still on the way.
    for (const s of reachable('on_site')) expect(inStateGroup('awaitingArrival', s), s).toBe(false);
    // A technician's load is an assigned call that is not over.
    const load: readonly CallState[] = callStateGroups.technicianLoad;
    for (const s of load) expect(inStateGroup('unfixed', s), s).toBe(true);
    expect(load).not.toContain('reported');
    for (const s of callStates) expect(inStateGroup('open', s), s).toBe(transitions[s].length > 0);
  });
});
