const DECISION_WORDS: Record<string, string> = { approve: 'Approved', return: 'Returned', withdraw: 'Withdrew' };

export type CommentItem = {
  id: string;
  decision: string | null;
  body: string;
  createdAt: Date;
  authorName: string | null;
  authorEmail: string | null;
};

/** Officers' decisions and comments on a version, oldest first. */
export function CommentList({ comments, empty = 'No comments yet.' }: { comments: CommentItem[]; empty?: string }) {
  if (comments.length === 0) return <p className="text-sm text-ink-muted">{empty}</p>;
  return (
    <ol className="space-y-3" data-testid="comments">
      {comments.map((c) => (
        <li key={c.id} className="rounded-md border border-line bg-paper px-3 py-2 text-sm">
          <p className="text-xs text-ink-muted">
            <span className="font-semibold text-ink">{c.decision ? DECISION_WORDS[c.decision] ?? c.decision : 'Comment'}</span>
            {' · '}
            {c.authorName ?? c.authorEmail ?? 'someone'} · <time dateTime={c.createdAt.toISOString()}>{formatWhen(c.createdAt)}</time>
          </p>
          {c.body ? <p className="mt-1 whitespace-pre-wrap">{c.body}</p> : null}
        </li>
      ))}
    </ol>
  );
}

export function formatWhen(d: Date | null | undefined): string {
  if (!d) return '—';
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}
