import { renderMessage, type Rendered } from './templates';

type VersionRef = { protocolName: string; number: number; labName: string };

const title = (v: VersionRef) => `${v.protocolName} v${v.number}`;

/** To each safety officer when a version is submitted. */
export function submittedMessage(v: VersionRef & { submitter: string; rigName: string; justification: string | null; url: string }): Rendered {
  return renderMessage(
    `Review requested: ${title(v)}`,
    [
      `${v.submitter} submitted ${title(v)} in ${v.labName} for review. It would run on ${v.rigName}.`,
      ...(v.justification ? [`Their justification for the warnings: ${v.justification}`] : []),
      'Nothing reaches a rig until a safety officer approves this exact version.',
    ],
    { url: v.url, label: 'Open the review' },
  );
}

/** To the author (and the submitter) when an officer approves or returns their version. */
export function decisionMessage(v: VersionRef & { decision: 'approve' | 'return'; officer: string; comment: string; checksum: string | null; url: string }): Rendered {
  const approved = v.decision === 'approve';
  return renderMessage(
    approved ? `Approved: ${title(v)}` : `Returned: ${title(v)}`,
    [
      approved
        ? `${v.officer} approved ${title(v)} in ${v.labName}. Its rig can now fetch it.`
        : `${v.officer} returned ${title(v)} in ${v.labName}. Copy it into a new version to address the comments.`,
      ...(v.comment ? [`Comments: ${v.comment}`] : []),
      ...(approved && v.checksum ? [`Approved schedule checksum: ${v.checksum}`] : []),
    ],
    { url: v.url, label: 'Open the version' },
  );
}

/** To the author when an officer withdraws an approved version. */
export function withdrawnMessage(v: VersionRef & { officer: string; reason: string; url: string }): Rendered {
  return renderMessage(
    `Withdrawn: ${title(v)}`,
    [`${v.officer} withdrew ${title(v)} in ${v.labName}. Rigs can no longer fetch it.`, `Reason: ${v.reason}`],
    { url: v.url, label: 'Open the version' },
  );
}
