// What the navigation offers each role: the sections in groups for wide screens and the phone's menu sheet, and
// the three main destinations of the phone's bottom bar (the fourth is "More"). Each link shows only with its
// permission; a link for one role only (My day is a technician's) says so.
import {
  CalendarClock,
  CircuitBoard,
  ClipboardCheck,
  ClipboardList,
  Gauge,
  History,
  Hourglass,
  Joystick,
  Map,
  MapPinned,
  Package,
  Route,
  Settings,
  Siren,
  Store,
  Truck,
  Users,
  Warehouse,
} from 'lucide-react';
import { can, type Permission, type Role } from '@bumperline/contracts/roles';
import { paths } from '../lib/paths.ts';

export interface NavLinkSpec {
  to: string;
  label: string;
  icon: typeof Gauge;
  needs?: Permission;
  /** Shown to these roles only (a permission several roles share, but a screen meant for one). */
  roles?: readonly Role[];
  /** Matches only its own path, not the paths below it. */
  end?: boolean;
}

export interface NavGroup {
  label: string;
  links: NavLinkSpec[];
}

const myDay: NavLinkSpec = { to: paths.myDay, label: 'My day', icon: Route, needs: 'route-days:read', roles: ['technician'] };
const today: NavLinkSpec = { to: paths.today, label: 'Today', icon: Gauge, roles: ['owner', 'dispatcher'] };
const venueHome: NavLinkSpec = { to: paths.today, label: 'My venue', icon: Store, needs: 'venue-view' };
const calls: NavLinkSpec = { to: paths.calls, label: 'Calls', icon: Siren, needs: 'calls:read' };
const routeDays: NavLinkSpec = { to: paths.routeDays, label: 'Route days', icon: Map, needs: 'route-days:plan' };
const vanStock: NavLinkSpec = { to: paths.vanStock, label: 'Van stock', icon: Truck, needs: 'stock:move', roles: ['technician'] };

const groups: NavGroup[] = [
  {
    label: 'Work',
    links: [
      today,
      myDay,
      venueHome,
      calls,
      routeDays,
      { to: paths.workOrders, label: 'Work orders', icon: ClipboardCheck, needs: 'care-plans:read' },
      { to: paths.carePlans, label: 'Care plans', icon: CalendarClock, needs: 'care-plans:read' },
    ],
  },
  {
    label: 'Fleet',
    links: [
      { to: paths.venues, label: 'Venues', icon: MapPinned, needs: 'venues:read' },
      { to: paths.games, label: 'Games', icon: Joystick, needs: 'games:read' },
    ],
  },
  {
    label: 'Bench',
    links: [
      { to: paths.bench, label: 'Bench', icon: CircuitBoard, needs: 'bench:read' },
      { to: paths.partsLists, label: 'Parts lists', icon: ClipboardList, needs: 'bench:read' },
      { to: paths.recapDue, label: 'Recap due', icon: Hourglass, needs: 'bench:read' },
    ],
  },
  {
    label: 'Stock',
    links: [
      { to: paths.parts, label: 'Parts', icon: Package, needs: 'stock:read' },
      { to: paths.stock, label: 'Stock', icon: Warehouse, needs: 'stock:manage', end: true },
      vanStock,
    ],
  },
  {
    label: 'Admin',
    links: [
      { to: paths.team, label: 'Team', icon: Users, needs: 'team:read' },
      { to: paths.activity, label: 'Activity', icon: History, needs: 'audit:read' },
      { to: paths.settings, label: 'Settings', icon: Settings, needs: 'settings:manage' },
    ],
  },
];

function allowed(link: NavLinkSpec, role: Role | null | undefined): boolean {
  if (link.roles && (!role || !link.roles.includes(role))) return false;
  return !link.needs || can(role, link.needs);
}

/** The groups this role sees, each with at least one link. */
export function navGroupsFor(role: Role | null | undefined): NavGroup[] {
  return groups.map((g) => ({ ...g, links: g.links.filter((l) => allowed(l, role)) })).filter((g) => g.links.length > 0);
}

/** The phone's bottom bar before "More": a technician's day, calls and van; the office's today, calls and route days. */
export function bottomBarFor(role: Role | null | undefined): NavLinkSpec[] {
  const candidates = role === 'technician' ? [myDay, calls, vanStock] : [today, venueHome, calls, routeDays];
  return candidates.filter((l) => allowed(l, role)).slice(0, 3);
}
