import { beforeEach, describe, expect, it, vi } from 'vitest';
import { changeLine, queueChange } from '../lib/queued-change.ts';

const photos = new Map<string, Blob>();
vi.mock('../lib/queued-photos.ts', () => ({
  readQueuedPhoto: (key: string) => Promise.resolve(photos.get(key)),
  dropQueuedPhoto: (key: string) => {
    photos.delete(key);
    return Promise.resolve();
  },
}));
const api = vi.fn();
vi.mock('../lib/api-client.ts', async (original) => ({
  ...(await original<typeof import('../lib/api-client.ts')>()),
  api: (...args: unknown[]) => api(...args) as unknown,
}));
const { sendChange } = await import('./technician-changes.ts');
const { ApiError } = await import('../lib/api-client.ts');

const photoChange = () =>
  queueChange(
    {
      kind: 'call-photo',
      callId: 'call-1',
      photoKey: 'call-photo-1',
      label: { what: 'Photo: Medieval Knight', where: 'Lucky Star Tavern' },
    },
    new Date('2026-12-03T10:42:00Z'),
    () => 'key-photo-0001',
  );

beforeEach(() => {
  photos.clear();
  api.mockReset();
});

describe('a queued call photo', () => {
  it('is named by game and venue and carries the key of its picture, not the picture', () => {
    const change = photoChange();
    expect(changeLine(change)).toBe('Photo: Medieval Knight — Lucky Star Tavern');
    expect(change).toMatchObject({ kind: 'call-photo', photoKey: 'call-photo-1', key: 'key-photo-0001' });
    // What is kept in the offline copy: small, and nothing but text.
    expect(JSON.stringify(change).length).toBeLessThan(300);
  });

  it('reads the picture at send time, sends it as the form field photo with its Idempotency-Key, then drops it', async () => {
    photos.set('call-photo-1', new Blob([new Uint8Array([0xff, 0xd8, 0xff])], { type: 'image/jpeg' }));
    api.mockResolvedValue({ photoId: 'p1' });
    await sendChange(photoChange());
    expect(api).toHaveBeenCalledTimes(1);
    const [method, path, opts] = api.mock.calls[0] as [string, string, { body: FormData; headers: Record<string, string> }];
    expect([method, path]).toEqual(['POST', '/api/calls/call-1/photos']);
    expect(opts.headers).toEqual({ 'Idempotency-Key': 'key-photo-0001' });
    const sent = opts.body.get('photo');
    expect(sent).toBeInstanceOf(Blob);
    expect((sent as Blob).size).toBe(3);
    expect(photos.has('call-photo-1')).toBe(false);
  });

  it('keeps the picture when the office did not answer, so the retry can send it', async () => {
    photos.set('call-photo-1', new Blob([new Uint8Array([1])]));
    api.mockRejectedValue(new TypeError('Failed to fetch'));
    await expect(sendChange(photoChange())).rejects.toThrow('Failed to fetch');
    expect(photos.has('call-photo-1')).toBe(true);
  });

  it('a picture no longer on the phone is a refusal (shown to the technician), not an endless retry', async () => {
    const error = await sendChange(photoChange()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect((error as InstanceType<typeof ApiError>).status).toBe(410);
    expect(api).not.toHaveBeenCalled();
  });
});
