/** Runs the SMTP fake as its own process: node --import tsx api/fakes/smtp-fake-main.ts PORT DIR */
import { startSmtpFake } from './smtp-fake';

const [port = '4325', dir = '.data/mail'] = process.argv.slice(2);
await startSmtpFake(Number(port), dir);
console.log(`SMTP fake listening on 127.0.0.1:${port}, keeping messages in ${dir}`);
