/** True when an error means PostgreSQL could not be reached (as opposed to a bad query). */
export function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  const code = e?.code ?? e?.cause?.code;
  return (
    code === 'ECONNREFUSED' ||
    code === 'ENOTFOUND' ||
    code === 'ETIMEDOUT' ||
    code === 'CONNECT_TIMEOUT' ||
    code === 'CONNECTION_CLOSED' ||
    code === 'CONNECTION_ENDED' ||
    code === '57P01' || // admin_shutdown
    code === '57P03' // cannot_connect_now
  );
}
