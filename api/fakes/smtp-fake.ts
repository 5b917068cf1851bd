/** A local SMTP fake (smtp-server on loopback): keeps every received message as an .eml file in a folder. */
import { randomBytes } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

export function startSmtpFake(port: number, dir: string): Promise<SMTPServer> {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Brinkmark local SMTP fake',
    size: 20 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        writeFileSync(join(dir, `${Date.now()}-${randomBytes(4).toString('hex')}.eml`), Buffer.concat(chunks));
        callback();
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(server));
  });
}
