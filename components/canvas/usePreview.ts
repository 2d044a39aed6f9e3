'use client';
import { keepPreviousData, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import type { Spec, SpecError } from '@/lib/schedule/spec';
import type { PreviewResponse } from '@/lib/preview/types';
import { useDebouncedValue } from './useDebouncedValue';

export class PreviewRequestError extends Error {
  constructor(
    message: string,
    readonly errors: SpecError[] = [],
  ) {
    super(message);
    this.name = 'PreviewRequestError';
  }
}

async function fetchPreview(url: string, body: string, signal: AbortSignal): Promise<PreviewResponse> {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body, signal });
  if (res.ok) return (await res.json()) as PreviewResponse;
  let errors: SpecError[] = [];
  try {
    const json = (await res.json()) as { errors?: SpecError[] };
    errors = Array.isArray(json.errors) ? json.errors : [];
  } catch {
    // a non-JSON error page: the status line says enough
  }
  throw new PreviewRequestError(errors.length ? 'The server refused this spec.' : `Preview failed (HTTP ${res.status}).`, errors);
}

export const PREVIEW_DEBOUNCE_MS = 400;

/**
 * Live preview of the spec being edited. Requests wait until edits pause
 * (PREVIEW_DEBOUNCE_MS); the query is keyed by the request body, and react-query aborts
 * the fetch of a key nobody watches any more, so an older request never overwrites a
 * newer preview. The last preview stays on screen while the next one loads.
 */
export function usePreview({ spec, valid, trials, url }: { spec: Spec; valid: boolean; trials: number; url: string }) {
  // Debounce the spec object, not its JSON: a long envelope is serialized once per pause, not per edit.
  const wanted = valid ? spec : null;
  const settledSpec = useDebouncedValue(wanted, PREVIEW_DEBOUNCE_MS);
  const settled = useMemo(() => (settledSpec ? JSON.stringify({ spec: settledSpec, trials }) : null), [settledSpec, trials]);
  const queryClient = useQueryClient();

  const query = useQuery({
    queryKey: ['preview', url, settled],
    queryFn: ({ signal }) => fetchPreview(url, settled!, signal),
    enabled: settled !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
    retry: false,
    refetchOnWindowFocus: false,
  });

  // Belt and braces: stop any preview still loading for an older spec.
  useEffect(() => {
    void queryClient.cancelQueries({ predicate: (q) => q.queryKey[0] === 'preview' && q.queryKey[2] !== settled });
  }, [queryClient, settled]);

  return {
    data: query.data,
    error: query.error as PreviewRequestError | null,
    /** Waiting for edits to pause, or a request in flight. */
    loading: wanted !== settledSpec || query.isFetching,
    /** What is shown belongs to an older version of the spec. */
    stale: query.isPlaceholderData || wanted !== settledSpec,
    blocked: wanted === null,
  };
}
