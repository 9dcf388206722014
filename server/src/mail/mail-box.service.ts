import { open, readdir, readFile, stat } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { Inject, Injectable } from '@nestjs/common';
import { decodeCursor, encodeCursor, type MailListQuery, type MailListResponse, type MailMessage } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { parseEmlHeaders } from './eml-headers.js';
import { ORGANISATION_HEADER } from './mail.service.js';

/** `<letters, digits, dot, dash, underscore>.eml`, no path separators and no leading dot. */
const MAIL_NAME = /^[A-Za-z0-9][A-Za-z0-9._-]{0,195}\.eml$/;
const HEADER_BYTES = 32 * 1024;
const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

function isMissing(error: unknown): boolean {
  return (error as NodeJS.ErrnoException | undefined)?.code === 'ENOENT';
}

/**
 * Development aid: reads the `.eml` files that the local SMTP fake (scripts/lib/fakes.mjs) writes
 * into MAIL_DIR, so invitation and reset links can be followed without a real mailbox. It reads
 * nothing from a real mail server and is off unless MAIL_DIR is set (and always off in production).
 */
@Injectable()
export class MailBoxService {
  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  private folder(): string {
    if (!this.config.MAIL_DIR || (this.config.NODE_ENV !== 'development' && this.config.NODE_ENV !== 'test')) {
      throw new AppError(ErrorCode.NotFound, 'Captured mail is only available with the local mail fake (MAIL_DIR)');
    }
    return resolve(this.config.MAIL_DIR);
  }

  /** Newest first (by file time, then name); the cursor is the last (time, name) of the previous page. */
  async list(query: MailListQuery, organisationId: string): Promise<MailListResponse> {
    const dir = this.folder();
    let after: { mtime: number; name: string } | null = null;
    if (query.cursor !== undefined) {
      const position = decodeCursor(query.cursor, 'date', 'desc');
      if (!position || typeof position.value !== 'number') {
        throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
          { path: ['cursor'], code: 'invalid_cursor', message: 'Not a cursor of this list' },
        ]);
      }
      after = { mtime: position.value, name: position.id };
    }
    let names: string[];
    try {
      names = (await readdir(dir)).filter((n) => MAIL_NAME.test(n));
    } catch (error) {
      if (isMissing(error)) return { items: [], nextCursor: null };
      throw error;
    }
    const dated = await Promise.all(
      names.map(async (name) => ({ name, mtime: await stat(join(dir, name)).then((s) => s.mtimeMs, () => null) })),
    );
    const newestFirst = (a: { mtime: number; name: string }, b: { mtime: number; name: string }) =>
      b.mtime - a.mtime || (a.name < b.name ? 1 : a.name > b.name ? -1 : 0);
    const files = dated
      .filter((f): f is { name: string; mtime: number } => f.mtime !== null)
      .sort(newestFirst)
      .filter((f) => !after || newestFirst(after, f) < 0);
    // Only the caller's organisation's messages (the header every Plummet message of an organisation carries).
    const page: { file: { name: string; mtime: number }; item: MailMessage }[] = [];
    let more = false;
    for (const file of files) {
      const { item, organisationId: owner } = await this.summary(dir, file.name);
      if (owner !== organisationId) continue;
      if (page.length === query.limit) {
        more = true;
        break;
      }
      page.push({ file, item });
    }
    const last = page[page.length - 1]?.file;
    const nextCursor = more && last ? encodeCursor({ sort: 'date', order: 'desc', value: last.mtime, id: last.name }) : null;
    return { items: page.map((p) => p.item), nextCursor };
  }

  /** The raw message text; 400 for a name that is not a plain `.eml` file name, 404 when absent. */
  async read(name: string, organisationId: string): Promise<string> {
    const dir = this.folder();
    if (!MAIL_NAME.test(name) || name.includes('..')) {
      throw new AppError(ErrorCode.ValidationFailed, 'Not a captured message name', [
        { path: ['name'], code: 'invalid_format', message: 'Expected a file name ending in .eml' },
      ]);
    }
    const file = resolve(dir, name);
    if (file !== join(dir, name)) throw AppError.notFound('Message');
    try {
      const info = await stat(file);
      if (!info.isFile()) throw AppError.notFound('Message');
      if (info.size > MAX_MESSAGE_BYTES) throw new AppError(ErrorCode.PayloadTooLarge, 'The message is too large to show');
      const raw = await readFile(file, 'utf8');
      const headerEnd = raw.search(/\r?\n\r?\n/);
      if (parseEmlHeaders(raw.slice(0, headerEnd < 0 ? raw.length : headerEnd)).get(ORGANISATION_HEADER.toLowerCase()) !== organisationId) {
        throw AppError.notFound('Message');
      }
      return raw;
    } catch (error) {
      if (isMissing(error)) throw AppError.notFound('Message');
      throw error;
    }
  }

  private async summary(dir: string, name: string): Promise<{ item: MailMessage; organisationId: string | undefined }> {
    let head = '';
    try {
      const handle = await open(join(dir, name), 'r');
      try {
        const buffer = Buffer.alloc(HEADER_BYTES);
        const { bytesRead } = await handle.read(buffer, 0, HEADER_BYTES, 0);
        head = buffer.subarray(0, bytesRead).toString('utf8');
      } finally {
        await handle.close();
      }
    } catch (error) {
      if (!isMissing(error)) throw error;
    }
    const headers = parseEmlHeaders(head);
    const date = headers.get('date');
    const parsed = date ? new Date(date) : null;
    const item = {
      name,
      subject: headers.get('subject') ?? '',
      to: headers.get('to') ?? '',
      date: parsed && !Number.isNaN(parsed.getTime()) ? parsed.toISOString() : null,
    };
    return { item, organisationId: headers.get(ORGANISATION_HEADER.toLowerCase()) };
  }
}
