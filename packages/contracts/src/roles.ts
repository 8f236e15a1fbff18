// Who may do what: the one permission table the API enforces, the web app reads to hide
// what a role cannot do, and the tests walk through.
export const roles = ['owner', 'dispatcher', 'technician', 'venue_contact'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  dispatcher: 'Dispatcher',
  technician: 'Technician',
  venue_contact: 'Venue contact',
};

export const permissions = {
  'venues:read': ['owner', 'dispatcher', 'technician'],
  'venues:write': ['owner', 'dispatcher'],
  'games:read': ['owner', 'dispatcher', 'technician'],
  'games:write': ['owner', 'dispatcher'],
  'models:write': ['owner', 'dispatcher'],
  'team:read': ['owner', 'dispatcher'],
  'team:manage': ['owner'],
  /** The company's own record (name, time zone, currency): every staff role reads it. */
  'company:read': ['owner', 'dispatcher', 'technician'],
  'company:manage': ['owner'],
  'audit:read': ['owner'],
  'calls:read': ['owner', 'dispatcher', 'technician'],
  'calls:open': ['owner', 'dispatcher', 'technician'],
  'calls:dispatch': ['owner', 'dispatcher'],
  'calls:work': ['owner', 'dispatcher', 'technician'],
  /** Whom the call's messages went to (a reporter's phone, a venue's e-mail) in full; others see them masked. */
  'calls:contacts': ['owner', 'dispatcher'],
  'settings:manage': ['owner'],
  /** Parts lists, boards in games and their readings, bench-job templates and jobs: what the bench works from. */
  'bench:read': ['owner', 'dispatcher', 'technician'],
  /** Models' boards and their parts lists (technicians keep them as much as the office). */
  'parts-lists:write': ['owner', 'dispatcher', 'technician'],
  /** Boards fitted in games: serial, date code, last recap; a cabinet's temperature through the day. */
  'boards:write': ['owner', 'dispatcher', 'technician'],
  /** Open, work on and finish bench jobs. */
  'bench:work': ['owner', 'dispatcher', 'technician'],
  /** Bench-job templates: their steps and cautions. */
  'bench-templates:write': ['owner', 'technician'],
  /** Care plans and the work orders they create: everyone on staff reads them; the office writes plans. */
  'care-plans:read': ['owner', 'dispatcher', 'technician'],
  'care-plans:write': ['owner', 'dispatcher'],
  /** Plan work orders: give them a technician and a day (the technician moves only the day of their own). */
  'work-orders:plan': ['owner', 'dispatcher'],
  /** Do, skip (with a reason) or move the day of a work order. */
  'work-orders:work': ['owner', 'dispatcher', 'technician'],
  /** Read and record meters (plays, power-on hours; collections read the money meters). */
  'meters:write': ['owner', 'dispatcher', 'technician'],
  /** Route days: a technician reads their own; the office reads every technician's. */
  'route-days:read': ['owner', 'dispatcher', 'technician'],
  /** Reorder a day's stops, move stops between technicians and days. */
  'route-days:plan': ['owner', 'dispatcher'],
  /** The parts catalogue, stocks and their movements. */
  'stock:read': ['owner', 'dispatcher', 'technician'],
  /** Catalogue entries, stock locations, reorder points, receiving from suppliers. */
  'stock:manage': ['owner', 'dispatcher'],
  /** Transfers and counts (a technician: to, from and of their own van); parts used on jobs. */
  'stock:move': ['owner', 'dispatcher', 'technician'],
  'venue-view': ['venue_contact'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && (permissions[permission] as readonly Role[]).includes(role);
}
