import { sampleResponse } from '@/lib/rig-api/sample';

// A real handler on every request (not prerendered at build), like the rest of the rig API.
export const dynamic = 'force-dynamic';

/** GET /api/rig/v1/sample.json — public sample schedule for trying rig scripts; no token, no database. */
export function GET(request: Request) {
  return sampleResponse(request, 'json');
}
