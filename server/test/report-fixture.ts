import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { type ParsedMail, simpleParser } from 'mailparser';
import { DEMO, finishBody, findingBody, inspectionBody } from './data-api.js';
import { noiseJpeg } from './images.js';
import { postPhoto, photoForm } from './photo-requests.js';
import { api } from './request.js';

export const SCRIPT_NOTE = '<script>alert("x")</script> left on the lift & "loose"';
export const LONG_NOTE = `Boards stacked near the edge ${'and more boards stacked without a toe board '.repeat(8)}end of note.`;

/** Findings of different weights and heights, so the bands and scores differ (computed by the server). */
const FINDINGS = [
  { item: { name: 'Hand tool (spanner)', massKg: 0.4 }, heightM: 3, lift: 2, bay: 1, exposure: 'zone-closed', notes: SCRIPT_NOTE },
  { item: { name: 'Scaffold board offcut', massKg: 6 }, heightM: 11, lift: 5, bay: 4, exposure: 'public', notes: LONG_NOTE },
  { item: { name: 'Loose fitting', massKg: 1.1 }, heightM: 7, lift: 3, bay: 2, exposure: 'hard-hats', notes: '' },
];

export interface FinishedInspection {
  inspectionId: string;
  findings: { id: string; itemName: string; riskBand: string; riskScore: number; elevation: string; lift: number; bay: number; heightM: number }[];
}

/** As the demo inspector: an inspection on QL-A with three findings (one photo) and a control check, finished and signed. */
export async function finishDemoInspection(baseUrl: string, inspectorToken: string, options: { findings?: boolean } = {}): Promise<FinishedInspection> {
  const call = (method: string, path: string, body?: unknown) => api(baseUrl, method, path, { token: inspectorToken, body });
  const inspection = await call('POST', '/inspections', inspectionBody(DEMO.foremansScaffold));
  if (inspection.status !== 201) throw new Error(`inspection: ${inspection.status} ${JSON.stringify(inspection.body)}`);
  const inspectionId = inspection.body.id as string;
  const findings: FinishedInspection['findings'] = [];
  for (const f of options.findings === false ? [] : FINDINGS) {
    const res = await call('POST', '/findings', findingBody(DEMO.foremansScaffold, { ...f, inspectionId }));
    if (res.status !== 201) throw new Error(`finding: ${res.status} ${JSON.stringify(res.body)}`);
    findings.push({ id: res.body.id, itemName: res.body.item.name, riskBand: res.body.riskBand, riskScore: res.body.riskScore, elevation: res.body.elevation, lift: res.body.lift, bay: res.body.bay, heightM: res.body.heightM });
  }
  if (findings.length > 0) {
    const photo = await postPhoto(baseUrl, inspectorToken, photoForm({ id: randomUUID(), ownerType: 'finding', ownerId: findings[1].id }, { bytes: await noiseJpeg() }));
    if (photo.status !== 201) throw new Error(`photo: ${photo.status} ${await photo.text()}`);
  }
  await call('PUT', `/inspections/${inspectionId}/control-checks/toe-boards`, { result: 'fail', note: 'Missing on lift 5' });
  const finished = await call('POST', `/inspections/${inspectionId}/finish`, finishBody({ signature: 'M 20 150 C 80 20, 140 20, 200 120 S 320 180, 400 60 L 560 90' }));
  if (finished.status !== 200) throw new Error(`finish: ${finished.status} ${JSON.stringify(finished.body)}`);
  return { inspectionId, findings };
}

export async function parseEml(mailDir: string, name: string): Promise<ParsedMail> {
  return simpleParser(readFileSync(join(mailDir, name)), { keepCidLinks: true });
}

/** The PDF's text through Debian's pdftotext (poppler-utils), a general-purpose extractor. */
export function pdfText(pdf: Buffer): string {
  return execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf, maxBuffer: 64 * 1024 * 1024 }).toString('utf8');
}

/** Collapses the wrapping pdftotext keeps, so phrases can be found across line ends. */
export const flat = (text: string) => text.replace(/\s+/g, ' ');
