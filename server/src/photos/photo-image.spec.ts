import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { bandColour, exifGpsLatitudeRef, noiseJpeg, sidewaysJpegWithGps } from '../../test/images.js';
import { detectImageType, processPhoto } from './photo-image.js';

describe('detectImageType', () => {
  it('tells a JPEG, a PNG and a WebP by their bytes', async () => {
    const base = sharp({ create: { width: 8, height: 8, channels: 3, background: '#123456' } });
    expect(await detectImageType(await base.clone().jpeg().toBuffer())).toBe('image/jpeg');
    expect(await detectImageType(await base.clone().png().toBuffer())).toBe('image/png');
    expect(await detectImageType(await base.clone().webp().toBuffer())).toBe('image/webp');
  });

  it('refuses text whatever the file is called, with 415 UNSUPPORTED_MEDIA_TYPE', async () => {
    await expect(detectImageType(Buffer.from('just some notes, not a photo\n'))).rejects.toMatchObject({
      code: 'UNSUPPORTED_MEDIA_TYPE',
    });
  });

  it('refuses an image type outside the list (GIF)', async () => {
    const gif = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#123456' } }).gif().toBuffer();
    await expect(detectImageType(gif)).rejects.toMatchObject({ code: 'UNSUPPORTED_MEDIA_TYPE' });
  });
});

describe('processPhoto', () => {
  it('turns a sideways photo upright and drops its GPS position by default', async () => {
    const out = await processPhoto(await sidewaysJpegWithGps(), 'image/jpeg', { keepLocation: false });
    const meta = await sharp(out.photo).metadata();
    expect([meta.width, meta.height]).toEqual([200, 400]);
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation ?? 1).toBe(1);
    const top = await bandColour(out.photo, 0.05, 0.45);
    expect(top.r).toBeGreaterThan(top.b);
  });

  it('keeps the GPS position, upright, when the organisation keeps locations', async () => {
    const out = await processPhoto(await sidewaysJpegWithGps(), 'image/jpeg', { keepLocation: true });
    const meta = await sharp(out.photo).metadata();
    expect([meta.width, meta.height]).toEqual([200, 400]);
    expect(exifGpsLatitudeRef(meta.exif)).toBe('N');
    expect(meta.orientation ?? 1).toBe(1);
  });

  it('shrinks the long edge to 2560 px and makes a 320 px thumbnail without metadata', async () => {
    const big = await sharp({ create: { width: 3000, height: 1500, channels: 3, background: '#336699' } }).jpeg().toBuffer();
    const out = await processPhoto(big, 'image/jpeg', { keepLocation: true });
    expect([out.width, out.height]).toEqual([2560, 1280]);
    const thumb = await sharp(out.thumbnail).metadata();
    expect([thumb.width, thumb.height, thumb.format]).toEqual([320, 160, 'jpeg']);
    expect(thumb.exif).toBeUndefined();
  });

  it('gives the same hash for the same upload, and the sha256 of the stored bytes', async () => {
    const input = await noiseJpeg();
    const a = await processPhoto(input, 'image/jpeg', { keepLocation: false });
    const b = await processPhoto(input, 'image/jpeg', { keepLocation: false });
    expect(a.contentHash).toBe(b.contentHash);
    const { createHash } = await import('node:crypto');
    expect(a.contentHash).toBe(createHash('sha256').update(a.photo).digest('hex'));
  });

  it('re-encodes PNG to JPEG', async () => {
    const png = await sharp({ create: { width: 40, height: 30, channels: 4, background: '#ff000080' } }).png().toBuffer();
    const out = await processPhoto(png, 'image/png', { keepLocation: false });
    expect((await sharp(out.photo).metadata()).format).toBe('jpeg');
  });

  it('answers 415 for bytes that look like a JPEG but do not decode', async () => {
    const fake = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(200, 7)]);
    await expect(processPhoto(fake, 'image/jpeg', { keepLocation: false })).rejects.toMatchObject({ code: 'UNSUPPORTED_MEDIA_TYPE' });
  });
});
