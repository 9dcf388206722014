import { CAUTION_TEXT } from '@plummet/shared';
import { dateTime } from '../../reports/report-format.js';
import { headerText } from '../header-text.js';
import { escapeHtml } from '../mail.layout.js';
import { wrapText } from '../report-mail.layout.js';
import { BANDS, type DigestSite } from './digest-content.js';

export interface DigestMailInput {
  recipientName: string;
  role: 'manager' | 'foreman';
  organisationName: string;
  /** The organisation's local day, e.g. 2026-03-10. */
  localDate: string;
  timeZone: string;
  sites: DigestSite[];
  appUrl: string;
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** The daily digest: one section per site (open findings by band, overdue fixes, inspections due); text and escaped HTML. */
export function renderDigestMail(input: DigestMailInput): { subject: string; text: string; html: string } {
  const { sites, timeZone } = input;
  const overdue = sites.reduce((n, s) => n + s.overdueFixes.length, 0);
  const due = sites.reduce((n, s) => n + s.dueScaffolds.length, 0);
  const subject = `Daily digest · ${headerText(input.organisationName, 80)} · ${input.localDate} · ${plural(overdue, 'overdue fix')} · ${plural(due, 'inspection')} due`;
  const scope = input.role === 'foreman' ? 'your scaffolds and the findings assigned to you' : 'every site';
  const intro = `Good morning ${input.recipientName}. Where things stand on ${input.localDate} for ${scope}.`;

  const text: string[] = [wrapText(intro), ''];
  const html: string[] = [
    '<!doctype html><html><head><meta charset="utf-8"></head><body style="font-family:\'Open Sans\',Arial,sans-serif;line-height:1.45;color:#111;max-width:720px">',
    `<p>${escapeHtml(intro)}</p>`,
  ];
  for (const s of sites) {
    text.push(`== ${s.siteName} ==`);
    html.push(`<h2 style="font-size:17px;margin:18px 0 6px">${escapeHtml(s.siteName)}</h2>`);
    const bands = BANDS.map((b) => `${b} ${s.openByBand[b]}`).join(', ');
    text.push(`Open findings by band: ${bands}`);
    html.push(`<p style="margin:4px 0"><strong>Open findings by band:</strong> ${escapeHtml(bands)}</p>`);

    text.push(`Overdue fixes (${s.overdueFixes.length}):`);
    html.push(`<p style="margin:8px 0 2px"><strong>Overdue fixes (${s.overdueFixes.length})</strong></p>`);
    if (s.overdueFixes.length === 0) html.push('<p style="margin:0;color:#555">None.</p>');
    else html.push('<ul style="margin:0">');
    for (const f of s.overdueFixes) {
      const line = `[${f.band}] ${f.itemName} on scaffold ${f.scaffoldReference}, due ${dateTime(f.dueAt, timeZone)}`;
      text.push(wrapText(`- ${line}`, 76, '  ').replace(/^  /, ''));
      html.push(`<li>${escapeHtml(line)}</li>`);
    }
    if (s.overdueFixes.length === 0) text.push('  None.');
    else html.push('</ul>');

    text.push(`Scaffolds due for inspection today or overdue (${s.dueScaffolds.length}):`);
    html.push(`<p style="margin:8px 0 2px"><strong>Scaffolds due for inspection today or overdue (${s.dueScaffolds.length})</strong></p>`);
    if (s.dueScaffolds.length === 0) html.push('<p style="margin:0;color:#555">None.</p>');
    else html.push('<ul style="margin:0">');
    for (const d of s.dueScaffolds) {
      const line = `Scaffold ${d.reference}: ${d.overdue ? 'overdue since' : 'due'} ${dateTime(d.nextDueAt, d.timeZone)}`;
      text.push(wrapText(`- ${line}`, 76, '  ').replace(/^  /, ''));
      html.push(`<li>${escapeHtml(line)}</li>`);
    }
    if (s.dueScaffolds.length === 0) text.push('  None.');
    else html.push('</ul>');
    text.push('');
  }
  text.push('Open Plummet:', input.appUrl, '', '--', 'Plummet', wrapText(CAUTION_TEXT));
  html.push(
    `<p><a href="${escapeHtml(input.appUrl)}">Open Plummet</a></p>`,
    `<hr><p style="font-size:12px;color:#444">Plummet<br>${escapeHtml(CAUTION_TEXT)}</p></body></html>`,
  );
  return { subject, text: `${text.join('\n')}\n`, html: html.join('') };
}
