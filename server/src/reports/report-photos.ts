import { Injectable } from '@nestjs/common';
import { ObjectStorage } from '../storage/object-storage.service.js';
import type { ReportFinding } from './report-data.js';

/** At most this many thumbnails go into one e-mail or PDF (the rest are counted, not shown). */
export const MAX_REPORT_PHOTOS = 60;
const PARALLEL = 8;

export interface ReportPhoto {
  id: string;
  findingId: string;
  jpeg: Buffer;
}

/** Reads the first photo's thumbnail (JPEG, no metadata) of each finding from object storage. */
@Injectable()
export class ReportPhotos {
  constructor(private readonly storage: ObjectStorage) {}

  async thumbnails(list: ReportFinding[]): Promise<Map<string, ReportPhoto>> {
    const wanted = list.flatMap((f) => (f.photos[0] ? [{ findingId: f.row.id, photo: f.photos[0] }] : [])).slice(0, MAX_REPORT_PHOTOS);
    const out = new Map<string, ReportPhoto>();
    for (let i = 0; i < wanted.length; i += PARALLEL) {
      const batch = await Promise.all(
        wanted.slice(i, i + PARALLEL).map(async ({ findingId, photo }) => {
          const object = await this.storage.get(photo.thumbnailKey);
          if (!object) return null; // uploaded metadata whose bytes never arrived: shown as "no photo"
          const chunks: Buffer[] = [];
          for await (const chunk of object.body) chunks.push(Buffer.from(chunk as Uint8Array));
          return { id: photo.id, findingId, jpeg: Buffer.concat(chunks) };
        }),
      );
      for (const p of batch) if (p) out.set(p.findingId, p);
    }
    return out;
  }
}
