import type { VersionStatus } from '@/db/schema/protocols';

export type { VersionStatus };

export const VERSION_STATUSES = ['draft', 'in_review', 'approved', 'returned', 'withdrawn'] as const satisfies readonly VersionStatus[];

/** Plain words for the five states, as people in the lab say them. */
export const STATUS_LABELS: Record<VersionStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  returned: 'Returned',
  withdrawn: 'Withdrawn',
};

export const STATUS_HELP: Record<VersionStatus, string> = {
  draft: 'Editable by experimenters of the lab. Nothing reaches a rig.',
  in_review: 'Frozen and waiting for a safety officer.',
  approved: 'Signed off by a safety officer; rigs may fetch exactly this schedule. It can no longer change.',
  returned: 'Sent back with comments. Copy it into a new version to address them.',
  withdrawn: 'Taken out of use. Kept for the record.',
};
