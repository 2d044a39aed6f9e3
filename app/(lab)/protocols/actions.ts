'use server';

import { headers } from 'next/headers';
import { memberAction } from '@/lib/auth/guard';
import { clientAddress } from '@/lib/auth/rate-limit';
import { env } from '@/lib/env';
import { deliverSoon } from '@/lib/mail/deliver';
import { copySchema, draftRigSchema, draftSpecSchema, protocolFormSchema, submitSchema, withdrawSchema } from '@/lib/versions/schemas';
import {
  copyVersion,
  createProtocol,
  saveDraftSpec,
  setDraftRig,
  submitVersion,
  withdrawVersion,
  type RequestContext,
} from '@/lib/versions/workflow';

// Thin wrappers: memberAction checks the session, the lab and the role and parses the input;
// the workflow checks the version's state and the person's part in it, in one transaction.
// Pages are rendered per request, so the client refreshes or navigates after each action.

async function requestContext(): Promise<RequestContext> {
  return { ip: clientAddress(await headers()), appUrl: env().APP_URL };
}

export const createProtocolAction = memberAction('protocols.edit', protocolFormSchema, async (input, member) =>
  createProtocol(member, input, await requestContext()),
);

export const saveDraftSpecAction = memberAction('protocols.edit', draftSpecSchema, async (input, member) =>
  saveDraftSpec(member, input, await requestContext()),
);

export const setDraftRigAction = memberAction('protocols.edit', draftRigSchema, async (input, member) =>
  setDraftRig(member, input, await requestContext()),
);

export const submitVersionAction = memberAction('protocols.submit', submitSchema, async (input, member) => {
  const res = await submitVersion(member, input, await requestContext());
  deliverSoon();
  return res;
});

// Withdrawing is an experimenter's (their own submission) or an officer's (an approval):
// the permission here only admits lab members; the state machine decides the rest.
export const withdrawVersionAction = memberAction('protocols.view', withdrawSchema, async (input, member) => {
  const res = await withdrawVersion(member, input, await requestContext());
  deliverSoon();
  return res;
});

export const copyVersionAction = memberAction('protocols.edit', copySchema, async (input, member) =>
  copyVersion(member, input, await requestContext()),
);
