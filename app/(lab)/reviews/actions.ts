'use server';

import { headers } from 'next/headers';
import { memberAction } from '@/lib/auth/guard';
import { clientAddress } from '@/lib/auth/rate-limit';
import { env } from '@/lib/env';
import { deliverSoon } from '@/lib/mail/deliver';
import { decisionSchema } from '@/lib/versions/schemas';
import { decideVersion } from '@/lib/versions/workflow';

/** Approve or return: safety officers only; the workflow refuses the version's own authors. */
export const decideVersionAction = memberAction('reviews.decide', decisionSchema, async (input, member) => {
  const res = await decideVersion(member, input, { ip: clientAddress(await headers()), appUrl: env().APP_URL });
  deliverSoon();
  return res;
});
