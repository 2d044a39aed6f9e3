// The local fake SMTP server: accepts every message on 127.0.0.1, prints one log line, and
// stores it in dev_mailbox so the development mailbox page (and the browser tests) can read it.
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import postgres from 'postgres';

const port = Number(process.env.MAIL_CATCHER_PORT ?? 2525);
const url = process.env.DATABASE_URL;
if (!url) {
  console.error('mail-catcher: DATABASE_URL is not set');
  process.exit(1);
}
const sql = postgres(url, { max: 2, onnotice: () => {} });

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

const server = new SMTPServer({
  // The package's built-in STARTTLS certificate has expired; plain SMTP on loopback only.
  disabledCommands: ['STARTTLS', 'AUTH'],
  authOptional: true,
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then(async (mail) => {
        const to = addresses(mail.to) || session.envelope.rcptTo.map((r) => r.address).join(', ');
        const from = addresses(mail.from) || (session.envelope.mailFrom ? session.envelope.mailFrom.address : '');
        const subject = mail.subject ?? '(no subject)';
        await sql`INSERT INTO dev_mailbox ("from", "to", subject, text, html)
                  VALUES (${from}, ${to}, ${subject}, ${mail.text ?? ''}, ${typeof mail.html === 'string' ? mail.html : ''})`;
        console.log(`mail-catcher: ${new Date().toISOString()} to=${to} subject="${subject}"`);
        callback();
      })
      .catch((err: Error) => {
        console.error(`mail-catcher: could not store a message: ${err.message}`);
        callback(err);
      });
  },
});

server.on('error', (err) => console.error(`mail-catcher: ${err.message}`));
server.listen(port, '127.0.0.1', () => console.log(`mail-catcher: listening on smtp://127.0.0.1:${port}`));

async function shutdown() {
  server.close(() => undefined);
  await sql.end({ timeout: 2 });
  process.exit(0);
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
