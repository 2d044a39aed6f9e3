import 'server-only';
import { deliverOutbox } from './outbox';
import { sendMail } from './transport';

/** Kick delivery after a commit without making the request wait for SMTP. */
export function deliverSoon(): void {
  setTimeout(() => {
    deliverOutbox(sendMail).catch((err: Error) => console.error(`[pulseloom] outbox delivery: ${err.message}`));
  }, 0);
}
