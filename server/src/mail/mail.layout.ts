import { CAUTION_TEXT } from '@plummet/shared';

/** What a feature hands to MailService: its own words, without the footer. */
export interface MailContent {
  subject: string;
  /** Paragraphs of plain text; the HTML version is built from the same paragraphs. */
  paragraphs: string[];
  /** An optional call to action shown as a link in HTML and as a bare URL in text. */
  action?: { label: string; url: string };
}

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Renders text and HTML bodies; both end with the safety caution every Plummet e-mail carries. */
export function renderMail(content: MailContent): { text: string; html: string } {
  const textParts = [...content.paragraphs];
  if (content.action) textParts.push(`${content.action.label}: ${content.action.url}`);
  const text = `${textParts.join('\n\n')}\n\n--\nPlummet\n${CAUTION_TEXT}\n`;

  const htmlParts = content.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`);
  if (content.action) {
    const url = escapeHtml(content.action.url);
    htmlParts.push(`<p><a href="${url}">${escapeHtml(content.action.label)}</a></p><p style="font-size:12px">${url}</p>`);
  }
  const html =
    '<!doctype html><html><body style="font-family:sans-serif;line-height:1.5">' +
    htmlParts.join('') +
    `<hr><p style="font-size:12px;color:#444">Plummet<br>${escapeHtml(CAUTION_TEXT)}</p>` +
    '</body></html>';
  return { text, html };
}
