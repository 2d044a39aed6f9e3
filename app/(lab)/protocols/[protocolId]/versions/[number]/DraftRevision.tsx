'use client';

import { createContext, useContext, useEffect, useState } from 'react';

type Ctx = { revision: number; setRevision: (r: number) => void };
const DraftRevisionContext = createContext<Ctx | null>(null);

/**
 * The draft's revision as this page last changed it. A save bumps the revision; the submit
 * form must send the new one at once, not the one the page was rendered with, or the
 * author's own save would look like someone else's change.
 */
export function DraftRevisionProvider({ initial, children }: { initial: number; children: React.ReactNode }) {
  const [revision, setRevision] = useState(initial);
  useEffect(() => setRevision((r) => Math.max(r, initial)), [initial]);
  return <DraftRevisionContext.Provider value={{ revision, setRevision }}>{children}</DraftRevisionContext.Provider>;
}

export function useDraftRevision(fallback: number): Ctx {
  return useContext(DraftRevisionContext) ?? { revision: fallback, setRevision: () => {} };
}
