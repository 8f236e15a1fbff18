// "Send the link again" for an address not yet confirmed. The API answers the same for any address,
// so the words after sending promise nothing about the account.
import { useState } from 'react';
import { post } from '../../lib/api-client.ts';
import { FormAlert } from './auth-layout.tsx';

export function ResendConfirmation({ email }: { email: string }) {
  const [state, setState] = useState<'idle' | 'busy' | 'sent' | 'failed'>('idle');
  if (state === 'sent') return <FormAlert tone="ok">If {email} still needs confirming, a new link is on its way.</FormAlert>;
  return (
    <>
      <button
        type="button"
        className="btn-secondary mb-4 w-full"
        disabled={state === 'busy'}
        onClick={async () => {
          setState('busy');
          try {
            await post('/api/account/verify-email/resend', { email });
            setState('sent');
          } catch {
            setState('failed');
          }
        }}
      >
        {state === 'busy' ? 'Sending…' : 'Send the link again'}
      </button>
      {state === 'failed' && <FormAlert>Could not send it just now. Try again in a moment.</FormAlert>}
    </>
  );
}
