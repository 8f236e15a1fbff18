// Who speaks for this venue: the venue contacts who see it in their venue view.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { inputClass } from '../../components/field.tsx';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useLinkVenueContact, useVenueContacts } from '../../api/venues.ts';

export function VenueContactsSection({ venueId }: { venueId: string }) {
  const contacts = useVenueContacts(venueId);
  const link = useLinkVenueContact(venueId);
  const canWrite = useCan('venues:write');
  const [choice, setChoice] = useState('');
  const linked = new Set(contacts.data?.items.map((c) => c.userId));
  const candidates = contacts.data?.candidates.filter((c) => !linked.has(c.userId)) ?? [];
  return (
    <section className="card grid content-start gap-2" aria-labelledby="venue-contacts-title">
      <h2 id="venue-contacts-title" className="text-lg font-bold">
        Venue view access
      </h2>
      <p className="text-sm text-ink-soft">These people see this venue’s games and calls, and can report problems, in their venue view.</p>
      {contacts.isLoading ? (
        <Loading />
      ) : contacts.error ? (
        <ErrorState error={contacts.error} onRetry={() => contacts.refetch()} />
      ) : !contacts.data?.items.length ? (
        <Empty title="Nobody from this venue has access yet." />
      ) : (
        <ul className="divide-y divide-paper-line">
          {contacts.data.items.map((c) => (
            <li key={c.userId} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                <span className="font-semibold">{c.name}</span> <span className="text-sm text-ink-muted">{c.email}</span>
              </span>
              {canWrite && (
                <button type="button" className="btn-secondary" onClick={() => link.mutate({ userId: c.userId, link: false })}>
                  Remove access
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
      {canWrite &&
        (candidates.length ? (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (choice) link.mutate({ userId: choice, link: true }, { onSuccess: () => setChoice('') });
            }}
          >
            <label className="grid flex-1 gap-1">
              <span className="font-semibold">Give access to</span>
              <select className={inputClass} value={choice} onChange={(e) => setChoice(e.target.value)}>
                <option value="">Choose a venue contact…</option>
                {candidates.map((c) => (
                  <option key={c.userId} value={c.userId}>
                    {c.name} ({c.email})
                  </option>
                ))}
              </select>
            </label>
            <button type="submit" className="btn-primary" disabled={!choice || link.isPending}>
              Give access
            </button>
          </form>
        ) : (
          <p className="text-sm text-ink-soft">
            To add someone, invite them as a venue contact on the{' '}
            <Link className="link" to={paths.team}>
              Team
            </Link>{' '}
            page first.
          </p>
        ))}
    </section>
  );
}
