// Retries queued mail in the background of the app server (Node runtime only).
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs' || !process.env.DATABASE_URL) return;
  const { deliverOutbox } = await import('./lib/mail/outbox');
  const { sendMail } = await import('./lib/mail/transport');
  setInterval(() => {
    deliverOutbox(sendMail).catch((err: Error) => console.error(`[pulseloom] outbox delivery: ${err.message}`));
  }, 10_000).unref();
}
