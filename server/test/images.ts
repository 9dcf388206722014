import sharp from 'sharp';

/** A photo-like JPEG of random noise (so its bytes, and its hash, are new every time). */
export async function noiseJpeg(width = 320, height = 240): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } } })
    .jpeg({ quality: 80 })
    .toBuffer();
}

/**
 * A landscape JPEG, left half red and right half blue with a random tint, saved sideways the
 * way phones do: EXIF orientation 6 (turn 90° clockwise to view) and a GPS position (51.5 N, 0.12 W).
 * Viewed upright it is portrait, red on top.
 */
export async function sidewaysJpegWithGps(width = 400, height = 200): Promise<Buffer> {
  const tint = Math.floor(Math.random() * 60);
  const half = (r: number, b: number) =>
    sharp({ create: { width: width / 2, height, channels: 3, background: { r, g: tint, b } } }).png().toBuffer();
  const withGps = await sharp({ create: { width, height, channels: 3, background: '#000' } })
    .composite([
      { input: await half(230, 20), left: 0, top: 0 },
      { input: await half(20, 230), left: width / 2, top: 0 },
    ])
    .withExif({
      IFD0: { Make: 'Plummet test camera' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 12/1' },
    })
    .jpeg({ quality: 90 })
    .toBuffer();
  // withMetadata keeps the EXIF just written and sets its orientation tag.
  return sharp(withGps).withMetadata({ orientation: 6 }).jpeg({ quality: 90 }).toBuffer();
}

/** The GPS latitude reference ('N'/'S') in an EXIF block as sharp returns it, or undefined when there is none. */
export function exifGpsLatitudeRef(exif: Buffer | undefined): string | undefined {
  if (!exif) return undefined;
  const tiff = exif.subarray(exif.indexOf('Exif\0\0') === 0 ? 6 : 0);
  const little = tiff.toString('latin1', 0, 2) === 'II';
  const u16 = (o: number) => (little ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (little ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const entries = (ifd: number) =>
    Array.from({ length: u16(ifd) }, (_, i) => ifd + 2 + i * 12).map((e) => ({ tag: u16(e), valueAt: e + 8 }));
  const gpsPointer = entries(u32(4)).find((e) => e.tag === 0x8825);
  if (!gpsPointer) return undefined;
  const latRef = entries(u32(gpsPointer.valueAt)).find((e) => e.tag === 0x0001);
  return latRef ? tiff.toString('latin1', latRef.valueAt, latRef.valueAt + 1) : undefined;
}

/** Mean colour of a horizontal band (fractions of the height), to tell which side is up. */
export async function bandColour(jpeg: Buffer, from: number, to: number): Promise<{ r: number; b: number }> {
  const { data, info } = await sharp(jpeg).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  let r = 0;
  let b = 0;
  let n = 0;
  for (let y = Math.floor(info.height * from); y < Math.floor(info.height * to); y++) {
    for (let x = 0; x < info.width; x++) {
      const i = (y * info.width + x) * info.channels;
      r += data[i];
      b += data[i + 2];
      n++;
    }
  }
  return { r: r / n, b: b / n };
}
