import { describe, expect, it } from 'vitest';
import { roles } from '@bumperline/contracts/roles';
import { paths } from '../lib/paths.ts';
import { bottomBarFor, navGroupsFor } from './navigation.ts';

const labels = (role: Parameters<typeof bottomBarFor>[0]) => bottomBarFor(role).map((l) => l.label);
const groupLinks = (role: Parameters<typeof navGroupsFor>[0]) =>
  Object.fromEntries(navGroupsFor(role).map((g) => [g.label, g.links.map((l) => l.label)]));

describe('bottomBarFor', () => {
  it('gives a technician their day, calls and van; the office today, calls and route days; a venue contact their venue', () => {
    expect(labels('technician')).toEqual(['My day', 'Calls', 'Van stock']);
    expect(labels('owner')).toEqual(['Today', 'Calls', 'Route days']);
    expect(labels('dispatcher')).toEqual(['Today', 'Calls', 'Route days']);
    expect(labels('venue_contact')).toEqual(['My venue']);
  });

  it('never holds more than three links (the fourth place is More)', () => {
    for (const role of roles) expect(bottomBarFor(role).length).toBeLessThanOrEqual(3);
  });
});

describe('navGroupsFor', () => {
  it('shows a technician no admin and no office planning, but their day and van', () => {
    const t = groupLinks('technician');
    expect(t.Admin).toBeUndefined();
    expect(t.Work).toEqual(['My day', 'Calls', 'Work orders', 'Care plans']);
    expect(t.Stock).toEqual(['Parts', 'Van stock']);
  });

  it('shows the owner every group, and the screens new to the product', () => {
    const o = groupLinks('owner');
    expect(Object.keys(o)).toEqual(['Work', 'Fleet', 'Bench', 'Stock', 'Admin']);
    const all = navGroupsFor('owner').flatMap((g) => g.links.map((l) => l.to));
    for (const to of [paths.carePlans, paths.workOrders, paths.routeDays, paths.parts, paths.stock]) expect(all).toContain(to);
  });

  it('shows a venue contact only their venue, and nobody signed out anything', () => {
    expect(groupLinks('venue_contact')).toEqual({ Work: ['My venue'] });
    expect(navGroupsFor(null)).toEqual([]);
  });
});
