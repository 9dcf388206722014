import { randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

export interface MailFake {
  /** Env for `startTestApp({ env })` so the server sends here. */
  env: { SMTP_HOST: string; SMTP_PORT: string; MAIL_DIR: string };
  mailDir: string;
  close(): Promise<void>;
}

/**
 * The SMTP fake `npm test` started (SMTP_PORT + MAIL_DIR in the environment), or one of our own
 * on a random loopback port writing .eml files like scripts/lib/fakes.mjs does.
 */
export async function useMailFake(options: { own?: boolean } = {}): Promise<MailFake> {
  const { SMTP_PORT, MAIL_DIR } = process.env;
  // `own`: a fake of the test's own, when other test files' mail to the same demo address would be ambiguous.
  if (SMTP_PORT && MAIL_DIR && !options.own) {
    return { env: { SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1', SMTP_PORT, MAIL_DIR }, mailDir: MAIL_DIR, close: async () => {} };
  }
  const mailDir = mkdtempSync(join(tmpdir(), 'plummet-mail-'));
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        writeFileSync(join(mailDir, `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}.eml`), Buffer.concat(chunks));
        callback();
      });
    },
  });
  const port = await new Promise<number>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(0, '127.0.0.1', () => resolve((smtp.server.address() as { port: number }).port));
  });
  return {
    env: { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(port), MAIL_DIR: mailDir },
    mailDir,
    async close() {
      await new Promise<void>((r) => smtp.close(() => r()));
      rmSync(mailDir, { recursive: true, force: true });
    },
  };
}

/** Undoes quoted-printable soft breaks and =XX escapes (good enough to find links in a raw .eml). */
export function decodeQuotedPrintable(raw: string): string {
  const bytes = Buffer.from(raw.replace(/=\r?\n/g, ''), 'latin1');
  const out: number[] = [];
  for (let i = 0; i < bytes.length; i++) {
    const hex = bytes.subarray(i + 1, i + 3).toString('latin1');
    if (bytes[i] === 0x3d && /^[0-9A-F]{2}$/.test(hex)) {
      out.push(parseInt(hex, 16));
      i += 2;
    } else out.push(bytes[i]);
  }
  return Buffer.from(out).toString('utf8');
}

/** Waits for a captured message to `to` (optionally containing `text`) and returns its file name and decoded text. */
export async function waitForMail(mailDir: string, to: string, text?: string, timeoutMs = 10_000): Promise<{ name: string; raw: string; decoded: string }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    for (const name of readdirSync(mailDir).filter((n) => n.endsWith('.eml')).sort().reverse()) {
      const raw = readFileSync(join(mailDir, name), 'utf8');
      const headerEnd = raw.search(/\r?\n\r?\n/);
      if (!new RegExp(`^To:.*${to.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`, 'im').test(raw.slice(0, headerEnd))) continue;
      const decoded = decodeQuotedPrintable(raw);
      if (!text || decoded.includes(text)) return { name, raw, decoded };
    }
    if (Date.now() > deadline) throw new Error(`no e-mail to ${to} arrived in ${mailDir}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The `token` of the first `<path>?token=…` link in a decoded message. */
export function linkToken(decoded: string, path: string): string {
  const match = new RegExp(`${path}\\?token=([A-Za-z0-9_-]{43})`).exec(decoded);
  if (!match) throw new Error(`no ${path} link in the message`);
  return match[1];
}

export interface OwnMailFake extends MailFake {
  /** Closes the SMTP port: the server's sends fail as with a mail server that is down. */
  stop(): Promise<void>;
  /** Listens again on the same port. */
  start(): Promise<void>;
  /** The .eml files captured so far, oldest first. */
  messages(): string[];
}

/** An SMTP fake of the test's own (never the shared one), which the test can stop and start again. */
export async function startOwnMailFake(): Promise<OwnMailFake> {
  const mailDir = mkdtempSync(join(tmpdir(), 'plummet-own-mail-'));
  let port = 0;
  let smtp: SMTPServer | null = null;
  const listen = async () => {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      size: 50 * 1024 * 1024,
      onData(stream, _session, callback) {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          writeFileSync(join(mailDir, `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}.eml`), Buffer.concat(chunks));
          callback();
        });
      },
    });
    port = await new Promise<number>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve((server.server.address() as { port: number }).port));
    });
    smtp = server;
  };
  const close = () => new Promise<void>((r) => (smtp ? smtp.close(() => r()) : r()));
  await listen();
  return {
    env: { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(port), MAIL_DIR: mailDir },
    mailDir,
    async stop() {
      await close();
      smtp = null;
    },
    start: listen,
    messages: () => readdirSync(mailDir).filter((n) => n.endsWith('.eml')).sort(),
    async close() {
      await close();
      rmSync(mailDir, { recursive: true, force: true });
    },
  };
}

/** Waits until `count` messages are in the folder (or the time is up) and returns their names. */
export async function waitForMessages(fake: OwnMailFake, count: number, timeoutMs = 30_000): Promise<string[]> {
  const deadline = Date.now() + timeoutMs;
  while (fake.messages().length < count && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
  return fake.messages();
}
