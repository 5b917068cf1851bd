/** A local SMTP fake (smtp-server on loopback): keeps every received message as an .eml file in a folder. */
import { randomBytes } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

const DEDUPE = /^x-brinkmark-dedupe-key:[ \t]*(.+?)\r?$/im;

/** The dedupe key in a raw message's header block, if any. */
function dedupeKeyOf(raw: Buffer): string | null {
  const text = raw.toString('utf8', 0, Math.min(raw.length, 64 * 1024));
  const end = text.search(/\r?\n\r?\n/);
  return DEDUPE.exec(end >= 0 ? text.slice(0, end) : text)?.[1]?.trim() ?? null;
}

/**
 * Keeps each message once: a repeat with a dedupe key already received (a sender retrying after an
 * unknown outcome) is acknowledged and dropped, as a receiving system that honours the key would.
 */
export function startSmtpFake(port: number, dir: string): Promise<SMTPServer> {
  mkdirSync(dir, { recursive: true });
  const seen = new Set(readdirSync(dir).filter((f) => f.endsWith('.eml')).map((f) => dedupeKeyOf(readFileSync(join(dir, f)))).filter((k) => k !== null));
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Brinkmark local SMTP fake',
    size: 20 * 1024 * 1024,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        const key = dedupeKeyOf(raw);
        if (key !== null && seen.has(key)) {
          console.error(`SMTP fake: repeat of ${key} dropped`);
          return callback();
        }
        if (key !== null) seen.add(key);
        writeFileSync(join(dir, `${Date.now()}-${randomBytes(4).toString('hex')}.eml`), raw);
        callback();
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(server));
  });
}
