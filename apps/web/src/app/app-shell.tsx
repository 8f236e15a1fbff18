// The signed-in frame: our mark, the sections this role may open, the company switcher, sign out.
import { useEffect, useRef } from 'react';
import { NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import {
  Hourglass,
  Building2,
  CircuitBoard,
  ClipboardList,
  Gauge,
  History,
  LogOut,
  MapPinned,
  Users,
  Joystick,
  Siren,
  Settings,
} from 'lucide-react';
import { can, roleLabels, type Permission } from '@bumperline/contracts/roles';
import { useMe } from '../api/me.ts';
import { useSwitchCompany } from '../api/switch-company.ts';
import { signOut } from '../lib/auth-client.ts';
import { paths } from '../lib/paths.ts';

const sections: { to: string; label: string; icon: typeof Gauge; needs?: Permission }[] = [
  { to: paths.home, label: 'Today', icon: Gauge },
  { to: paths.calls, label: 'Calls', icon: Siren, needs: 'calls:read' },
  { to: paths.venues, label: 'Venues', icon: MapPinned, needs: 'venues:read' },
  { to: paths.games, label: 'Games', icon: Joystick, needs: 'games:read' },
  { to: paths.bench, label: 'Bench', icon: CircuitBoard, needs: 'bench:read' },
  { to: paths.partsLists, label: 'Parts lists', icon: ClipboardList, needs: 'bench:read' },
  { to: paths.recapDue, label: 'Recap due', icon: Hourglass, needs: 'bench:read' },
  { to: paths.team, label: 'Team', icon: Users, needs: 'team:read' },
  { to: paths.activity, label: 'Activity', icon: History, needs: 'audit:read' },
  { to: paths.settings, label: 'Settings', icon: Settings, needs: 'settings:manage' },
];

export function AppShell() {
  const me = useMe();
  const navigate = useNavigate();
  const qc = useQueryClient();
  const switchCompany = useSwitchCompany();
  const role = me.data?.role;
  const visible = sections.filter((s) => !s.needs || can(role, s.needs));
  const sectionList = useRef<HTMLUListElement>(null);
  const { pathname } = useLocation();

  // On a phone the sections scroll sideways: bring the current one into view, or nothing shows where you are.
  useEffect(() => {
    const list = sectionList.current;
    const current = list?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!list || !current) return;
    const link = current.getBoundingClientRect();
    const frame = list.getBoundingClientRect();
    if (link.left < frame.left || link.right > frame.right) {
      list.scrollLeft += link.left - frame.left - (frame.width - link.width) / 2;
    }
  }, [pathname, visible.length]);

  return (
    <div className="min-h-screen">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-white focus:p-2"
      >
        Skip to content
      </a>
      <header className="bg-ink text-white print:hidden">
        <div className="mx-auto flex max-w-[96rem] flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
          <NavLink to={paths.home} className="flex items-center gap-2 text-xl font-extrabold">
            <span aria-hidden className="inline-block size-6 rounded-full border-[5px] border-brass-bright bg-ink" />
            Bumperline
          </NavLink>
          <div className="ml-auto flex flex-wrap items-center gap-3">
            {me.data && me.data.companies.length > 1 ? (
              <label className="flex items-center gap-2">
                <Building2 aria-hidden className="size-5" />
                <span className="sr-only">Company</span>
                <select
                  className="min-h-11 rounded-md border border-white/40 bg-ink px-2 font-semibold text-white"
                  value={me.data.company?.id ?? ''}
                  onChange={(e) => switchCompany.mutate(e.target.value, { onSuccess: () => navigate(paths.home) })}
                >
                  {me.data.companies.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name} ({roleLabels[c.role]})
                    </option>
                  ))}
                </select>
              </label>
            ) : (
              <span className="flex items-center gap-2 font-semibold">
                <Building2 aria-hidden className="size-5" /> {me.data?.company?.name}
              </span>
            )}
            <span className="hidden text-white/90 sm:inline">
              {me.data?.user.name} · {role ? roleLabels[role] : ''}
            </span>
            <button
              type="button"
              className="inline-flex min-h-11 items-center gap-1 rounded-md border border-white/40 px-3 font-semibold hover:bg-white/10"
              onClick={async () => {
                await signOut();
                qc.clear();
                navigate(paths.signIn, { replace: true });
              }}
            >
              <LogOut aria-hidden className="size-4" /> Sign out
            </button>
          </div>
        </div>
        <nav aria-label="Sections" className="border-t border-white/15">
          <ul ref={sectionList} className="mx-auto flex max-w-[96rem] gap-1 overflow-x-auto px-2">
            {visible.map((s) => (
              <li key={s.to}>
                <NavLink
                  to={s.to}
                  end={s.to === paths.home}
                  className={({ isActive }) =>
                    `flex min-h-11 items-center gap-2 border-b-4 px-3 font-semibold whitespace-nowrap ${isActive ? 'border-brass-bright text-white' : 'border-transparent text-white/85 hover:text-white'}`
                  }
                >
                  <s.icon aria-hidden className="size-4" />
                  {s.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" className="mx-auto max-w-[96rem] px-4 py-6 print:p-0">
        <Outlet />
      </main>
    </div>
  );
}
