// The signed-in frame. Wide screens: a top bar (company, person, theme, sign out) and the sections in groups down
// the side. Phones: a compact top bar and a bottom bar with the role's three main destinations and "More", which
// opens every section, the company switcher, the theme and sign-out in a sheet. Nothing runs off a 390 px screen.
import { useEffect, useRef, useState } from 'react';
import { Link, NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Building2, CloudUpload, LogOut, Menu, Moon, Sun, X } from 'lucide-react';
import { roleLabels } from '@bumperline/contracts/roles';
import { useMe } from '../api/me.ts';
import { useSwitchCompany } from '../api/switch-company.ts';
import { usePendingChanges } from '../api/technician-changes.ts';
import { signOut } from '../lib/auth-client.ts';
import { useFailedChanges } from '../lib/failed-changes.ts';
import { paths } from '../lib/paths.ts';
import { bottomBarFor, navGroupsFor, type NavGroup, type NavLinkSpec } from './navigation.ts';
import { forgetOfflineCopy } from './offline-store.ts';
import { useTheme } from './theme.ts';

/** Unsent changes would be lost by leaving: ask first, in words. */
function useLeaveGuard() {
  const pending = usePendingChanges().length + useFailedChanges().length;
  return (what: string) =>
    pending === 0 ||
    window.confirm(
      `${pending} change${pending === 1 ? ' has' : 's have'} not reached the office yet. ${what} anyway and lose ${pending === 1 ? 'it' : 'them'}?`,
    );
}

function ThemeToggle({ className = '' }: { className?: string }) {
  const [theme, choose] = useTheme();
  const dim = theme === 'dim';
  return (
    <button
      type="button"
      aria-pressed={dim}
      onClick={() => choose(dim ? 'light' : 'dim')}
      className={`inline-flex min-h-12 min-w-12 items-center justify-center gap-2 rounded-md border border-bar-text/40 px-3 font-semibold hover:bg-bar-text/10 ${className}`}
    >
      {dim ? <Moon aria-hidden className="size-5" /> : <Sun aria-hidden className="size-5" />}
      <span className="sr-only sm:not-sr-only">{dim ? 'Dim' : 'Light'}</span>
      <span className="sr-only"> theme: switch</span>
    </button>
  );
}

function CompanySwitcher() {
  const me = useMe();
  const navigate = useNavigate();
  const switchCompany = useSwitchCompany();
  const mayLeave = useLeaveGuard();
  if (!me.data) return null;
  if (me.data.companies.length <= 1) {
    return (
      <span className="flex min-w-0 items-center gap-2 font-semibold">
        <Building2 aria-hidden className="size-5 shrink-0" /> <span className="truncate">{me.data.company?.name}</span>
      </span>
    );
  }
  return (
    <label className="flex min-w-0 items-center gap-2">
      <Building2 aria-hidden className="size-5 shrink-0" />
      <span className="sr-only">Company</span>
      <select
        className="min-h-12 max-w-full min-w-0 rounded-md border border-bar-text/40 bg-bar px-2 font-semibold text-bar-text"
        value={me.data.company?.id ?? ''}
        onChange={(e) => {
          const tenantId = e.target.value;
          if (!mayLeave('Switch company')) {
            e.target.value = me.data?.company?.id ?? '';
            return;
          }
          switchCompany.mutate(tenantId, {
            onSuccess: async () => {
              await forgetOfflineCopy();
              navigate(paths.home);
            },
          });
        }}
      >
        {me.data.companies.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name} ({roleLabels[c.role]})
          </option>
        ))}
      </select>
    </label>
  );
}

function SignOutButton({ className = '' }: { className?: string }) {
  const navigate = useNavigate();
  const qc = useQueryClient();
  const mayLeave = useLeaveGuard();
  return (
    <button
      type="button"
      className={`inline-flex min-h-12 items-center gap-2 rounded-md border px-3 font-semibold ${className}`}
      onClick={async () => {
        if (!mayLeave('Sign out')) return;
        await signOut();
        await forgetOfflineCopy();
        qc.clear();
        navigate(paths.signIn, { replace: true });
      }}
    >
      <LogOut aria-hidden className="size-5" /> Sign out
    </button>
  );
}

/** "2 not sent" on the bar, for whoever has queued changes (a technician offline). */
function UnsentBadge() {
  const count = usePendingChanges().length + useFailedChanges().length;
  if (count === 0) return null;
  return (
    <Link
      to={paths.myChanges}
      className="inline-flex min-h-12 items-center gap-2 rounded-md bg-brass-bright px-3 font-extrabold whitespace-nowrap text-[#14213d] hover:bg-brass-light"
    >
      <CloudUpload aria-hidden className="size-5" />
      {count} not sent
    </Link>
  );
}

function SideLink({ link }: { link: NavLinkSpec }) {
  return (
    <NavLink
      to={link.to}
      end={link.end}
      className={({ isActive }) =>
        `flex min-h-11 items-center gap-3 rounded-md border-l-4 px-3 font-semibold ${isActive ? 'border-brass-bright bg-paper text-ink' : 'border-transparent text-ink-soft hover:bg-paper hover:text-ink'}`
      }
    >
      <link.icon aria-hidden className="size-5 shrink-0" />
      {link.label}
    </NavLink>
  );
}

function GroupedLinks({ groups, onPick }: { groups: NavGroup[]; onPick?: () => void }) {
  return (
    <div className="grid gap-4" onClick={onPick}>
      {groups.map((g) => (
        <section key={g.label} aria-labelledby={`nav-${g.label}`}>
          <h2 id={`nav-${g.label}`} className="mb-1 px-3 text-sm font-extrabold tracking-wide text-ink-muted uppercase">
            {g.label}
          </h2>
          <ul className="grid gap-0.5">
            {g.links.map((l) => (
              <li key={l.to + l.label}>
                <SideLink link={l} />
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

/** The phone's full menu: every section, the company, the theme, the person and sign-out. */
function MenuSheet({ open, onClose, groups }: { open: boolean; onClose: () => void; groups: NavGroup[] }) {
  const ref = useRef<HTMLDialogElement>(null);
  const me = useMe();
  const role = me.data?.role;
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-label="Menu"
      onClose={onClose}
      className="m-0 ml-auto h-dvh max-h-dvh w-[min(22rem,100vw)] max-w-none overflow-y-auto bg-paper-dim p-0 text-ink backdrop:bg-black/50"
    >
      {/* Rendered only while open: a closed sheet holds no second copy of the company name or the links. */}
      {open && (
        <>
          <div className="sticky top-0 z-10 flex items-center justify-between gap-2 bg-bar px-4 py-2 text-bar-text">
            <span className="text-lg font-extrabold">Menu</span>
            <button
              type="button"
              onClick={onClose}
              className="inline-flex min-h-12 min-w-12 items-center justify-center gap-1 rounded-md border border-bar-text/40 px-3 font-semibold"
            >
              <X aria-hidden className="size-5" /> Close
            </button>
          </div>
          <div className="grid gap-5 p-4">
            <div className="grid gap-3 rounded-lg bg-bar p-3 text-bar-text">
              <p className="font-semibold">
                {me.data?.user.name} · {role ? roleLabels[role] : ''}
              </p>
              <CompanySwitcher />
              <div className="flex flex-wrap gap-2">
                <ThemeToggle />
                <SignOutButton className="border-bar-text/40 hover:bg-bar-text/10" />
              </div>
            </div>
            <nav aria-label="All sections">
              <GroupedLinks groups={groups} onPick={onClose} />
            </nav>
          </div>
        </>
      )}
    </dialog>
  );
}

function BottomBar({ links, onMore }: { links: NavLinkSpec[]; onMore: () => void }) {
  const item = 'flex min-h-16 flex-1 flex-col items-center justify-center gap-0.5 px-1 text-sm font-bold';
  return (
    <nav
      aria-label="Main"
      className="fixed inset-x-0 bottom-0 z-30 border-t border-bar-text/20 bg-bar text-bar-text lg:hidden print:hidden"
    >
      <ul className="mx-auto flex max-w-xl pb-[env(safe-area-inset-bottom)]">
        {links.map((l) => (
          <li key={l.to + l.label} className="flex flex-1">
            <NavLink
              to={l.to}
              end={l.end}
              className={({ isActive }) => `${item} border-t-4 ${isActive ? 'border-brass-bright' : 'border-transparent opacity-90'}`}
            >
              <l.icon aria-hidden className="size-6" />
              {l.label}
            </NavLink>
          </li>
        ))}
        <li className="flex flex-1">
          <button type="button" onClick={onMore} className={`${item} border-t-4 border-transparent`}>
            <Menu aria-hidden className="size-6" />
            More
          </button>
        </li>
      </ul>
    </nav>
  );
}

export function AppShell() {
  const me = useMe();
  const role = me.data?.role;
  const groups = navGroupsFor(role);
  const { pathname } = useLocation();
  // The sheet is open on the screen it was opened from: a link picked in it (or the back button) closes it.
  const [openOn, setOpenOn] = useState<string | null>(null);
  const menuOpen = openOn === pathname;

  return (
    <div className="min-h-screen">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-paper focus:p-2"
      >
        Skip to content
      </a>
      <header className="sticky top-0 z-30 bg-bar text-bar-text print:hidden">
        <div className="mx-auto flex max-w-[110rem] items-center gap-3 px-3 py-2 lg:px-4">
          <NavLink to={paths.home} className="flex min-h-12 shrink-0 items-center gap-2 text-xl font-extrabold">
            <span aria-hidden className="inline-block size-6 rounded-full border-[5px] border-brass-bright bg-bar" />
            Bumperline
          </NavLink>
          <div className="ml-auto flex min-w-0 items-center gap-2">
            <UnsentBadge />
            <div className="hidden min-w-0 items-center gap-3 lg:flex">
              <CompanySwitcher />
              <span className="whitespace-nowrap opacity-90">
                {me.data?.user.name} · {role ? roleLabels[role] : ''}
              </span>
              <ThemeToggle />
              <SignOutButton className="border-bar-text/40 hover:bg-bar-text/10" />
            </div>
            <ThemeToggle className="lg:hidden" />
          </div>
        </div>
      </header>
      <div className="mx-auto flex max-w-[110rem]">
        <nav
          aria-label="Sections"
          className="sticky top-16 hidden max-h-[calc(100vh-4rem)] w-60 shrink-0 overflow-y-auto py-6 pl-3 lg:block print:hidden"
        >
          <GroupedLinks groups={groups} />
        </nav>
        <main id="main" className="min-w-0 flex-1 px-4 pt-5 pb-28 lg:py-6 print:p-0">
          <Outlet />
        </main>
      </div>
      <BottomBar links={bottomBarFor(role)} onMore={() => setOpenOn(pathname)} />
      <MenuSheet open={menuOpen} onClose={() => setOpenOn(null)} groups={groups} />
    </div>
  );
}
