import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { fail } from './log.mjs';
import { portInUse } from './postgres.mjs';

/**
 * Local stand-ins for hosted services, on loopback only:
 * - an SMTP server that keeps every message as an .eml file in `mailDir`;
 * - an S3-compatible object store (s3rver) with the photo bucket created at start.
 */
export async function startFakes({ mailDir, s3Dir, smtpPort, s3Port, bucket }) {
  for (const [port, what, env] of [[smtpPort, 'SMTP fake', 'SMTP_PORT'], [s3Port, 'object-store fake', 'S3_PORT']]) {
    if (port && (await portInUse(port))) fail(`port ${port} on 127.0.0.1 (${what}) is already in use; set ${env} to another port.`);
  }
  mkdirSync(mailDir, { recursive: true });
  mkdirSync(s3Dir, { recursive: true });
  const { SMTPServer } = await import('smtp-server');
  const { default: S3rver } = await import('s3rver');

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      const chunks = [];
      stream.on('data', (c) => chunks.push(c));
      stream.on('end', () => {
        const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}.eml`;
        writeFileSync(join(mailDir, name), Buffer.concat(chunks));
        callback();
      });
    },
  });
  const smtpAddress = await new Promise((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(smtpPort ?? 0, '127.0.0.1', () => resolve(smtp.server.address()));
  });

  const s3 = new S3rver({
    address: '127.0.0.1',
    port: s3Port ?? 0,
    silent: true,
    directory: s3Dir,
    configureBuckets: [{ name: bucket }],
  });
  const s3Address = await s3.run();

  return {
    smtpPort: smtpAddress.port,
    s3Port: s3Address.port,
    s3Endpoint: `http://127.0.0.1:${s3Address.port}`,
    async close() {
      await Promise.allSettled([new Promise((r) => smtp.close(r)), s3.close()]);
    },
  };
}
