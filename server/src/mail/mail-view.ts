import type { MailMessageView } from '@plummet/shared';
import { type AddressObject, simpleParser } from 'mailparser';

const addresses = (value: AddressObject | AddressObject[] | undefined) => (Array.isArray(value) ? value.map((v) => v.text).join(', ') : (value?.text ?? ''));

/** A captured .eml opened for the development viewer: inline images become data: URLs in the HTML. */
export async function viewOf(name: string, raw: string): Promise<MailMessageView> {
  const parsed = await simpleParser(raw);
  return {
    name,
    subject: parsed.subject ?? '',
    to: addresses(parsed.to),
    cc: addresses(parsed.cc),
    date: parsed.date ? parsed.date.toISOString() : null,
    text: parsed.text ?? '',
    html: parsed.html || null,
    attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size, inline: a.contentDisposition === 'inline' || Boolean(a.related) })),
  };
}
