// Photos on a step: take one with the phone's camera or upload a file (the API applies the same rules as the
// public report page's photos), then see the thumbnails.
import { useState } from 'react';
import { Camera, Loader2 } from 'lucide-react';
import type { BenchJobPhoto } from '@bumperline/contracts/bench-jobs';
import { useUploadBenchPhoto } from '../../api/bench-jobs.ts';
import { ApiError } from '../../lib/api-client.ts';
import { fieldDomId } from './field-problems.ts';

export function StepPhotos({
  jobId,
  stepKey,
  stepTitle,
  photos,
  readOnly,
  main,
  serverProblem,
}: {
  jobId: string;
  stepKey: string;
  stepTitle: string;
  photos: readonly BenchJobPhoto[];
  readOnly: boolean;
  /** The step's record is the photo itself. */
  main: boolean;
  /** What finishing said about this step's photos ("add a photo before ticking this step"). */
  serverProblem: string | undefined;
}) {
  const id = fieldDomId(`steps.${stepKey}.photos`);
  const upload = useUploadBenchPhoto(jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const mine = photos.filter((p) => p.stepKey === stepKey);
  const shown = problem ?? (mine.length ? undefined : serverProblem);
  if (readOnly && !mine.length) return null;
  return (
    <div className="grid gap-2">
      {mine.length > 0 && (
        <ul className="flex flex-wrap gap-2" aria-label="Photos on this step">
          {mine.map((p, i) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer" className="block">
                <img
                  src={p.thumbUrl}
                  alt={`Photo ${i + 1} on “${stepTitle}”`}
                  className="size-24 rounded-md border border-paper-line object-cover"
                  loading="lazy"
                />
              </a>
            </li>
          ))}
        </ul>
      )}
      {!readOnly && (
        <div>
          {/* The file input is hidden behind the button-like label, which shows the keyboard focus for it. */}
          <input
            id={id}
            type="file"
            accept="image/*"
            capture="environment"
            className="peer sr-only"
            disabled={upload.isPending}
            aria-describedby={shown ? `${id}-problem` : undefined}
            onChange={(e) => {
              const file = e.target.files?.[0];
              e.target.value = '';
              if (!file) return;
              setProblem(null);
              upload.mutate(
                { stepKey, file },
                {
                  onError: (err) =>
                    setProblem(
                      err instanceof ApiError
                        ? err.problem.errors?.map((x) => x.message).join(' ') || err.message
                        : 'The photo did not upload. Try again.',
                    ),
                },
              );
            }}
          />
          <label
            htmlFor={id}
            className={`${main ? 'btn-primary' : 'btn-secondary'} cursor-pointer peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-brass-bright`}
          >
            {upload.isPending ? <Loader2 aria-hidden className="size-4 animate-spin" /> : <Camera aria-hidden className="size-4" />}
            {upload.isPending ? 'Uploading…' : main ? 'Take or upload a photo' : 'Add a photo'}
          </label>
          {shown && (
            <p id={`${id}-problem`} role="alert" className="mt-1 text-sm font-semibold text-down">
              {shown}
            </p>
          )}
        </div>
      )}
    </div>
  );
}
