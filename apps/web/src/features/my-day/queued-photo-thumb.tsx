// A small picture of a photo still waiting on this phone, read from IndexedDB; nothing when it cannot be read.
import { useEffect, useState } from 'react';
import { readQueuedPhoto } from '../../lib/queued-photos.ts';

export function QueuedPhotoThumb({ photoKey }: { photoKey: string }) {
  const [url, setUrl] = useState<string>();
  useEffect(() => {
    let objectUrl: string | undefined;
    let live = true;
    readQueuedPhoto(photoKey)
      .then((blob) => {
        if (!blob || !live) return;
        objectUrl = URL.createObjectURL(blob);
        setUrl(objectUrl);
      })
      .catch(() => undefined);
    return () => {
      live = false;
      if (objectUrl) URL.revokeObjectURL(objectUrl);
    };
  }, [photoKey]);
  if (!url) return null;
  return <img src={url} alt="The queued photo" className="size-14 shrink-0 rounded-md border border-paper-line object-cover" />;
}
