import { CAUTION_TEXT, scaffoldStatusWords } from '@plummet/shared';
import { outcomeLines } from '../reports/report-outcome.js';
import { byRisk, type ReportData } from '../reports/report-data.js';
import { dateOnly, findingFacts } from '../reports/report-format.js';
import type { ReportPhoto } from '../reports/report-photos.js';
import { headerText } from './header-text.js';
import { escapeHtml } from './mail.layout.js';

const BAND_STYLE: Record<string, string> = {
  High: 'background:#8a1c1c;color:#fff',
  Medium: 'background:#f2d27a;color:#222',
  Low: 'background:#d9e8dc;color:#222',
};
const WRAP_AT = 76;

/** Wraps long lines at word boundaries for the plain-text part (nothing is cut). */
export function wrapText(text: string, width = WRAP_AT, indent = ''): string {
  return text
    .split(/\r?\n/)
    .map((line) => {
      const words = line.split(/\s+/).filter(Boolean);
      const lines: string[] = [];
      let current = '';
      for (const word of words) {
        if (current && current.length + 1 + word.length > width) {
          lines.push(current);
          current = word;
        } else current = current ? `${current} ${word}` : word;
      }
      lines.push(current);
      return lines.map((l) => indent + l).join('\n');
    })
    .join('\n');
}

export interface RenderedReportMail {
  subject: string;
  text: string;
  html: string;
  /** The inline images the HTML refers to as `cid:<cid>`. */
  images: { cid: string; jpeg: Buffer; findingId: string }[];
}

/** Subject: tag status, site, scaffold, date, High count; every user part flattened for the header. */
export function reportSubject(data: ReportData): string {
  const highs = data.findings.filter((f) => f.row.riskBand === 'High').length;
  const date = dateOnly(data.inspection.finishedAt ?? data.inspection.startedAt, data.organisation.settings.timeZone);
  return [
    headerText(scaffoldStatusWords(data.scaffold.status), 40),
    headerText(data.site.name, 80),
    `scaffold ${headerText(data.scaffold.reference, 40)}`,
    date,
    `${highs} High finding${highs === 1 ? '' : 's'}`,
  ].join(' · ');
}

/** The findings list: HTML (inline thumbnails by cid) and plain text with the same facts, risk order. */
export function renderReportMail(data: ReportData, photos: Map<string, ReportPhoto>, inspectionUrl: string): RenderedReportMail {
  const units = data.organisation.settings.defaultUnits;
  const tz = data.organisation.settings.timeZone;
  const list = [...data.findings].sort(byRisk);
  const intro = `${data.inspector.name} finished and signed the inspection of scaffold ${data.scaffold.reference} at ${data.site.name}. The signed report is attached as a PDF.`;
  const images: RenderedReportMail['images'] = [];

  const text: string[] = [wrapText(intro), ''];
  const html: string[] = [
    '<!doctype html><html><head><meta charset="utf-8"></head><body style="font-family:\'Open Sans\',Arial,sans-serif;line-height:1.45;color:#111;max-width:720px">',
    `<p>${escapeHtml(intro)}</p>`,
    `<p><strong>Scaffold tag status:</strong> ${escapeHtml(scaffoldStatusWords(data.scaffold.status))}</p>`,
  ];
  const outcome = outcomeLines(data.inspection);
  for (const [label, value] of outcome) text.push(wrapText(`${label}: ${value}`));
  text.push('');
  html.push(`<p>${outcome.map(([label, value]) => `<strong>${escapeHtml(label)}:</strong> ${escapeHtml(value)}`).join('<br>')}</p>`);
  if (list.length === 0) {
    text.push('No falling-object findings were recorded in this inspection.');
    html.push('<p><strong>No falling-object findings were recorded in this inspection.</strong></p>');
  } else {
    text.push(`Findings, highest risk first (${list.length}):`, '');
    html.push(`<h2 style="font-size:18px">Findings, highest risk first (${list.length})</h2><div>`);
  }
  list.forEach((f, index) => {
    const facts = findingFacts(f, units, tz);
    text.push(`${index + 1}. [${f.row.riskBand}] ${f.row.itemName}`);
    for (const [label, value] of facts) text.push(wrapText(`${label}: ${value}`, WRAP_AT, '   '));
    if (f.row.notes) text.push(wrapText(`Note: ${f.row.notes}`, WRAP_AT, '   '));
    text.push('');

    const photo = photos.get(f.row.id);
    let img = '<div style="width:96px;height:72px;background:#eee;font-size:11px;color:#555;text-align:center;line-height:72px">no photo</div>';
    if (photo) {
      const cid = `finding-${f.row.id}@plummet`;
      images.push({ cid, jpeg: photo.jpeg, findingId: f.row.id });
      img = `<img src="cid:${cid}" alt="Photo of ${escapeHtml(f.row.itemName)}" width="96" style="display:block;border-radius:4px">`;
    }
    const rows = facts.map(([label, value]) => `<div><span style="color:#555">${escapeHtml(label)}:</span> ${escapeHtml(value)}</div>`).join('');
    const note = f.row.notes ? `<div style="white-space:pre-wrap;overflow-wrap:anywhere"><span style="color:#555">Note:</span> ${escapeHtml(f.row.notes)}</div>` : '';
    html.push(
      `<div style="margin:0 0 14px"><table role="presentation" cellpadding="0" cellspacing="0" style="width:100%"><tr>` +
        `<td style="vertical-align:top;padding-right:12px;width:96px">${img}</td>` +
        `<td style="vertical-align:top;font-size:14px"><div style="font-weight:700;font-size:15px">` +
        `<span style="${BAND_STYLE[f.row.riskBand] ?? ''};padding:1px 6px;border-radius:3px;font-size:12px">${escapeHtml(f.row.riskBand)} ${f.row.riskScore}</span> ` +
        `${index + 1}. ${escapeHtml(f.row.itemName)}</div>${rows}${note}</td></tr></table></div>`,
    );
  });
  if (list.length > 0) html.push('</div>');
  const missing = list.filter((f) => f.photos.length > 0 && !photos.has(f.row.id)).length;
  if (missing > 0) {
    text.push(`${missing} further photo(s) are in the app.`);
    html.push(`<p>${missing} further photo(s) are in the app.</p>`);
  }
  text.push("Open the inspection in Plummet:", inspectionUrl, '', '--', 'Plummet', wrapText(CAUTION_TEXT));
  html.push(
    `<p><a href="${escapeHtml(inspectionUrl)}">Open the inspection in Plummet</a><br><span style="font-size:12px">${escapeHtml(inspectionUrl)}</span></p>`,
    `<hr><p style="font-size:12px;color:#444">Plummet<br>${escapeHtml(CAUTION_TEXT)}</p></body></html>`,
  );
  return { subject: reportSubject(data), text: `${text.join('\n')}\n`, html: html.join(''), images };
}
