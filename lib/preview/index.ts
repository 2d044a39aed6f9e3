export { previewRequestSchema, parsePreviewRequest, PREVIEW_DEFAULT_TRIALS, PREVIEW_MAX_TRIALS, type PreviewRequest, type PreviewErrorResponse } from './request';
export { buildPreview, rateEstimate, intervalHistogram, PREVIEW_BUDGET, RATE_METHOD, type BuildPreviewOptions } from './build';
export { poissonInterval95 } from './poisson';
export { truncateEnvelope } from './truncate';
export { PREVIEW_FORMAT, type PreviewResponse, type RateEstimate, type IntervalHistogram, type PreviewSummaryNumbers } from './types';
