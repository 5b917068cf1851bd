/** Reads what the local SMTP fake received (the test profile's folder). */
import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';

const folder = () => resolve(process.env.MAIL_FAKE_DIR ?? '.data/mail-test');
const emlFiles = async () => (await readdir(folder()).catch(() => [] as string[])).filter((f) => f.endsWith('.eml')).sort();

/** The messages in the folder now, so a spec can read only what arrives after it (old files may be left over). */
export async function mailboxMark(): Promise<ReadonlySet<string>> {
  return new Set(await emlFiles());
}

/** Every message received, or only those that arrived after `since` was taken. */
export async function received(since?: ReadonlySet<string>): Promise<ParsedMail[]> {
  const files = (await emlFiles()).filter((f) => !since?.has(f));
  return Promise.all(files.map(async (f) => simpleParser(await readFile(join(folder(), f)))));
}

export function recipients(m: ParsedMail): string[] {
  const to = Array.isArray(m.to) ? m.to : m.to ? [m.to] : [];
  return to.flatMap((a) => a.value.map((v) => v.address ?? ''));
}
