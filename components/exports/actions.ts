'use server';

import { headers } from 'next/headers';
import { z } from 'zod';
import { memberAction } from '@/lib/auth/guard';
import { clientAddress } from '@/lib/auth/rate-limit';
import { acknowledgeCautions } from '@/lib/exports/acknowledge';

const acknowledgeSchema = z.object({ versionId: z.uuid({ error: 'Unknown version' }) });

/** The person has read the export cautions for this version; recorded once, with an audit row. */
export const acknowledgeExportCautions = memberAction('exports.download', acknowledgeSchema, async (input, member) => {
  const ip = clientAddress(await headers());
  const r = await acknowledgeCautions({ labId: member.lab.id, userId: member.user.id, email: member.user.email, ip }, input.versionId);
  return { acknowledgedAt: r.acknowledgedAt.toISOString() };
});
