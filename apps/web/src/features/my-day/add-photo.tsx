// "Add a photo" on a service call at the stop: the camera opens, the picture waits in IndexedDB and a queued change
// sends it when there is signal (once, by its Idempotency-Key).
import { useId, useState } from 'react';
import { AlertTriangle, Camera, CheckCircle2 } from 'lucide-react';
import { useEnqueueChange } from '../../api/technician-changes.ts';
import { keepQueuedPhoto, newPhotoKey } from '../../lib/queued-photos.ts';

export function AddPhoto({ callId, game, where }: { callId: string; game: string; where: string }) {
  const enqueue = useEnqueueChange();
  const inputId = useId();
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string }>();

  async function take(file: File | undefined) {
    if (!file) return;
    const photoKey = newPhotoKey();
    try {
      await keepQueuedPhoto(photoKey, file);
    } catch {
      setOutcome({ ok: false, text: 'This phone could not keep the photo (storage full?). Try again.' });
      return;
    }
    enqueue({ kind: 'call-photo', callId, photoKey, label: { what: `Photo: ${game}`, where } });
    setOutcome({ ok: true, text: 'Photo added; it goes to the office when there is signal.' });
  }

  return (
    <div className="grid gap-1">
      <input
        id={inputId}
        type="file"
        accept="image/*"
        capture="environment"
        className="peer sr-only"
        onChange={(e) => {
          void take(e.target.files?.[0]);
          e.target.value = '';
        }}
      />
      <label
        htmlFor={inputId}
        className="btn-secondary peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-ink flex min-h-14 cursor-pointer items-center justify-center gap-2 text-lg"
      >
        <Camera aria-hidden className="size-6" />
        Add a photo
      </label>
      {outcome && (
        <p role="status" className={`flex items-start gap-2 ${outcome.ok ? 'text-ink-soft' : 'font-semibold text-down'}`}>
          {outcome.ok ? (
            <CheckCircle2 aria-hidden className="mt-0.5 size-5 shrink-0 text-running" />
          ) : (
            <AlertTriangle aria-hidden className="mt-0.5 size-5 shrink-0" />
          )}
          {outcome.text}
        </p>
      )}
    </div>
  );
}
