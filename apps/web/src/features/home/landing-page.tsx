// What anyone sees at / before signing in: what Bumperline does, and the way in.
import { Link } from 'react-router-dom';
import { BellRing, CalendarCheck, ChartLine, Coins, MapPinned, Wrench } from 'lucide-react';
import { paths } from '../../lib/paths.ts';

const points = [
  {
    icon: BellRing,
    title: 'Dead game? Reported in seconds',
    text: 'A game tag on every cabinet lets bar staff report a problem from their phone, no account needed.',
  },
  {
    icon: MapPinned,
    title: 'Dispatch on a map',
    text: 'See every down game and send the nearest technician who knows that kind of machine.',
  },
  {
    icon: Wrench,
    title: 'Route days and bench jobs',
    text: 'Technicians get their stops in driving order, with parts lists, readings and safety cautions.',
  },
  { icon: CalendarCheck, title: 'Care plans', text: 'Recaps, reflows and cleanings come due by calendar, by plays or by hours powered.' },
  {
    icon: Coins,
    title: 'Collections that add up',
    text: 'Meter readings, cash counts and venue splits computed to the cent, with statements.',
  },
  { icon: ChartLine, title: 'Know what each game earns', text: 'Uptime, earnings and keep cost per game, venue and model.' },
];

export function LandingPage() {
  return (
    <div className="min-h-screen bg-paper-dim">
      <header className="bg-ink text-white">
        <div className="mx-auto flex max-w-6xl items-center justify-between px-4 py-4">
          <span className="flex items-center gap-2 text-xl font-extrabold">
            <span aria-hidden className="inline-block size-6 rounded-full border-[5px] border-brass-bright bg-ink" />
            Bumperline
          </span>
          <Link
            to={paths.signIn}
            className="inline-flex min-h-11 items-center rounded-md border border-white/50 px-4 font-bold hover:bg-white/10"
          >
            Sign in
          </Link>
        </div>
        <div className="mx-auto max-w-6xl px-4 pt-8 pb-14">
          <h1 className="max-w-3xl text-4xl font-extrabold leading-tight md:text-5xl">Keep every game on your route earning.</h1>
          <p className="mt-4 max-w-2xl text-lg text-white/90">
            Bumperline is where operators of pinball, arcade, jukebox and darts machines run their route: service calls, technicians,
            preventive care, collections and the numbers that tell you which games to fix, move or retire.
          </p>
          <div className="mt-6 flex flex-wrap gap-3">
            <Link
              to={paths.signUp}
              className="inline-flex min-h-11 items-center rounded-md bg-brass-bright px-5 font-extrabold text-ink hover:bg-brass-light"
            >
              Start a free trial
            </Link>
            <Link
              to={paths.signIn}
              className="inline-flex min-h-11 items-center rounded-md border border-white/50 px-5 font-bold hover:bg-white/10"
            >
              I already have an account
            </Link>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-10">
        <h2 className="sr-only">What it does</h2>
        <ul className="grid gap-4 md:grid-cols-3">
          {points.map((p) => (
            <li key={p.title} className="card">
              <p.icon aria-hidden className="mb-2 size-7 text-brass" />
              <h3 className="text-lg font-bold">{p.title}</h3>
              <p className="mt-1 text-ink-soft">{p.text}</p>
            </li>
          ))}
        </ul>
        <p className="mt-8 text-center text-ink-soft">Priced by the number of games on location. Every plan starts with a free trial.</p>
      </main>
    </div>
  );
}
