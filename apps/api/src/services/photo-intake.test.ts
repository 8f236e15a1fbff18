import { crc32 } from 'node:zlib';
import sharp from 'sharp';
import { describe, expect, it, vi } from 'vitest';
import { MAX_INPUT_PIXELS, PhotoRejected, preparePhoto } from './photo-intake.ts';

/** A PNG chunk: length, type, data, CRC-32 over type and data (PNG specification, 2nd ed., §5.3). */
function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** A few hundred bytes whose header says width × height, 8-bit RGB: what a decoder would have to allocate. */
function pngClaiming(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8); // bit depth 8, colour type 2 (RGB), deflate, adaptive filtering, no interlace
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', Buffer.alloc(64)), chunk('IEND', Buffer.alloc(0))]);
}

describe('preparePhoto', () => {
  it('refuses a small file that would decode to a huge picture, from its header, before decoding', async () => {
    const bomb = pngClaiming(11_000, 10_900); // 119.9 megapixels in 127 bytes
    expect(bomb.length).toBeLessThan(200);
    const decode = vi.spyOn(sharp.prototype, 'toBuffer');
    await expect(preparePhoto(bomb)).rejects.toThrow(PhotoRejected);
    await expect(preparePhoto(bomb)).rejects.toThrow(/11000 × 10900 pixels \(120 megapixels\)/);
    expect(decode).not.toHaveBeenCalled();
    decode.mockRestore();
  });

  it('takes a picture just inside the limit and re-encodes it', async () => {
    expect(MAX_INPUT_PIXELS).toBe(50_000_000);
    const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#406080' } })
      .png()
      .toBuffer();
    const prepared = await preparePhoto(photo);
    expect(prepared).toMatchObject({ contentType: 'image/jpeg', width: 640, height: 480 });
  });
});
