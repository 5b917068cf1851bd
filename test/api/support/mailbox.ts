/** Reads what the local SMTP fake received (the test profile's folder). */
import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';

export async function received(): Promise<ParsedMail[]> {
  const dir = resolve(process.env.MAIL_FAKE_DIR ?? '.data/mail-test');
  const files = (await readdir(dir).catch(() => [] as string[])).filter((f) => f.endsWith('.eml')).sort();
  return Promise.all(files.map(async (f) => simpleParser(await readFile(join(dir, f)))));
}

export function recipients(m: ParsedMail): string[] {
  const to = Array.isArray(m.to) ? m.to : m.to ? [m.to] : [];
  return to.flatMap((a) => a.value.map((v) => v.address ?? ''));
}
