import { CAUTION_TEXT } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type OwnMailFake, startOwnMailFake, waitForMessages } from '../../test/mail-fake.js';
import { type FinishedInspection, finishDemoInspection, flat, LONG_NOTE, parseEml, pdfText, SCRIPT_NOTE } from '../../test/report-fixture.js';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';
import type { ParsedMail } from 'mailparser';

const FAST_QUEUE = { MAIL_RETRY_DELAY_S: '1', MAIL_POLL_S: '0.5' };

describe('the findings e-mail and signed report sent when an inspection is finished', () => {
  let mail: OwnMailFake;
  let t: TestApp;
  let done: FinishedInspection;
  let message: ParsedMail;
  let pdf: Buffer;
  let text: string;

  beforeAll(async () => {
    mail = await startOwnMailFake();
    t = await startTestApp({ env: { ...mail.env, ...FAST_QUEUE } });
    done = await finishDemoInspection(t.baseUrl, await t.tokenFor('inspector@demo.test'));
    const [name] = await waitForMessages(mail, 1);
    message = await parseEml(mail.mailDir, name);
    pdf = message.attachments.find((a) => a.contentType === 'application/pdf')!.content;
    text = flat(pdfText(pdf));
  }, 60_000);
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  const byRisk = () => [...done.findings].sort((a, b) => b.riskScore - a.riskScore || b.heightM - a.heightM);

  it('goes to the managers (the site has none of its own) and the assigned foremen, with the client contact copied', () => {
    const to = (message.to && !Array.isArray(message.to) ? message.to.value : []).map((a) => a.address);
    expect(to).toContain('manager@demo.test');
    const cc = (message.cc && !Array.isArray(message.cc) ? message.cc.value : []).map((a) => a.address);
    expect(cc).toEqual(expect.arrayContaining(['estates@eastmouth-libraries.test', 'site-reports@eastmouth-libraries.test']));
  });

  it('has a subject starting with the tag status, then site, scaffold, date and the count of High findings', () => {
    const highs = done.findings.filter((f) => f.riskBand === 'High').length;
    expect(message.subject).toMatch(/^Cleared for use · Quayside Library refurbishment · scaffold QL-A · \d{1,2} \w{3} \d{4} · \d+ High findings?$/);
    expect(message.subject).toContain(`${highs} High finding`);
  });

  it('lists every finding in the plain text with item, position and band, highest risk first', () => {
    const plain = message.text ?? '';
    const positions = byRisk().map((f) => plain.indexOf(`[${f.riskBand}] ${f.itemName}`));
    expect(positions.every((p) => p >= 0)).toBe(true);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
    for (const f of done.findings) expect(plain).toContain(`${f.elevation} elevation, lift ${f.lift}, bay ${f.bay}, ${f.heightM.toFixed(1)} m up`);
    expect(plain).toContain(CAUTION_TEXT.slice(0, 40));
    expect(plain).toMatch(/\/inspections\/[0-9a-f-]{36}/);
  });

  it('wraps a long note in the text part without cutting it', () => {
    const plain = message.text ?? '';
    const long = plain.split('\n').filter((line) => line.length > 80 && !/^https?:\/\//.test(line));
    expect(long).toEqual([]);
    expect(flat(plain)).toContain(flat(`Note: ${LONG_NOTE}`));
  });

  it('escapes a note holding a script tag in the HTML part', () => {
    const html = String(message.html);
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; left on the lift &amp; &quot;loose&quot;');
    expect(message.text).toContain(SCRIPT_NOTE);
    expect(html).toContain(CAUTION_TEXT);
  });

  it('shows the photo inline by content id, not as a link that needs signing in', () => {
    const inline = message.attachments.filter((a) => a.contentType === 'image/jpeg');
    expect(inline).toHaveLength(1);
    expect(String(message.html)).toContain(`cid:${inline[0].cid}`);
    expect(String(message.html)).not.toContain('/api/photos');
  });

  it('attaches a PDF holding every finding with item, position and band, in risk order', () => {
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const order = byRisk().map((f) => text.indexOf(`${f.riskBand} – ${f.itemName}`));
    expect(order.every((p) => p >= 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
    for (const f of done.findings) expect(text).toContain(`${f.elevation} elevation, lift ${f.lift}, bay ${f.bay}, ${f.heightM.toFixed(1)} m up`);
    expect(text).toContain(flat(SCRIPT_NOTE));
  });

  it('holds every particular that UK WAHR 2005 Schedule 7 requires, with the control checks, page numbers and caution', () => {
    // Work at Height Regulations 2005 (SI 2005/735), reg. 12(8) and Schedule 7, paragraphs 1–8.
    for (const heading of [
      'Name and address of the person for whom the inspection was carried out',
      'Location of the work equipment inspected',
      'Description of the work equipment inspected',
      'Date and time of the inspection',
      'Details of any matter identified that could give rise to a risk to the health or safety of any person',
      'Details of any action taken as a result of any matter identified',
      'Details of any further action considered necessary',
      'Name and position of the person making the report',
    ]) expect(text).toContain(heading);
    for (const value of ['Sample Client Ltd', 'Civic Hall, 2 Tollgate Square', '14 Wharfinger Lane', 'Scaffold QL-A', 'A loose coupler on lift 4', 'Coupler removed', 'Aileen Marsh, Scaffold inspector']) {
      expect(text).toContain(value);
    }
    expect(text).toContain('Toe boards: FAILED – Missing on lift 5');
    expect(text).toMatch(/Page 1 of \d+/);
    expect(text).toContain(flat(CAUTION_TEXT).slice(0, 60));
  });

  it('opens in the admin’s mail viewer with its HTML rendered and its attachments listed', async () => {
    const admin = await t.tokenFor('admin@demo.test');
    const [name] = mail.messages();
    const list = await api(t.baseUrl, 'GET', '/mail', { token: admin });
    expect(list.body.items.map((m: { name: string }) => m.name)).toContain(name);
    const view = await api(t.baseUrl, 'GET', `/mail/${name}/view`, { token: admin });
    expect(view.status).toBe(200);
    expect(view.body.attachments).toEqual(
      expect.arrayContaining([expect.objectContaining({ contentType: 'application/pdf', inline: false }), expect.objectContaining({ contentType: 'image/jpeg', inline: true })]),
    );
    const html = await fetch(`${t.baseUrl}/api/mail/${name}/html`, { headers: { authorization: `Bearer ${admin}` } });
    expect(html.headers.get('content-type')).toMatch(/^text\/html/);
    expect(html.headers.get('content-security-policy')).toContain('sandbox');
    expect(await html.text()).toContain('src="data:image/jpeg;base64,');
  });

  it('queued exactly one message for the inspection', async () => {
    await new Promise((r) => setTimeout(r, 1500));
    expect(mail.messages()).toHaveLength(1);
  });

  it('serves the same report as a PDF to managers and its inspector, 403 to another inspector or a foreman, 404 to another organisation', async () => {
    const path = `/inspections/${done.inspectionId}/report.pdf`;
    const get = async (email: string) => fetch(`${t.baseUrl}/api${path}`, { headers: { authorization: `Bearer ${await t.tokenFor(email)}` } });
    const managerRes = await get('manager@demo.test');
    expect(managerRes.status).toBe(200);
    expect(managerRes.headers.get('content-type')).toBe('application/pdf');
    expect(flat(pdfText(Buffer.from(await managerRes.arrayBuffer())))).toContain('Name and position of the person making the report');
    expect((await get('inspector@demo.test')).status).toBe(200);
    expect((await get('admin@demo.test')).status).toBe(200);
    expect((await get('foreman@demo.test')).status).toBe(403);
    expect((await get('manager@other.test')).status).toBe(404);
  });
});

describe('an inspection with no findings', () => {
  let mail: OwnMailFake;
  let t: TestApp;
  beforeAll(async () => {
    mail = await startOwnMailFake();
    t = await startTestApp({ env: { ...mail.env, ...FAST_QUEUE } });
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('says so plainly in the e-mail and the PDF, and a manager can send it again', async () => {
    const done = await finishDemoInspection(t.baseUrl, await t.tokenFor('inspector@demo.test'), { findings: false });
    const [name] = await waitForMessages(mail, 1);
    const first = await parseEml(mail.mailDir, name);
    expect(first.subject).toContain('0 High findings');
    expect(first.text).toContain('No falling-object findings were recorded in this inspection.');
    const pdf = first.attachments.find((a) => a.contentType === 'application/pdf')!.content;
    expect(flat(pdfText(pdf))).toContain('No falling-object findings were recorded in this inspection.');

    const resend = await api(t.baseUrl, 'POST', `/inspections/${done.inspectionId}/report/send`, { token: await t.tokenFor('manager@demo.test') });
    expect(resend.status).toBe(202);
    const names = await waitForMessages(mail, 2);
    const second = await parseEml(mail.mailDir, names[1]);
    expect(second.subject).toMatch(/^Re-sent: /);
    expect(second.cc).toBeUndefined();
    const byInspector = await api(t.baseUrl, 'POST', `/inspections/${done.inspectionId}/report/send`, { token: await t.tokenFor('inspector@demo.test') });
    expect(byInspector.status).toBe(403);
  });
});
