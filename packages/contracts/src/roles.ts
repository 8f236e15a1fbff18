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
  'venue-view': ['venue_contact'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissions;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && (permissions[permission] as readonly Role[]).includes(role);
}
