export * from './auth';
export * from './labs';
export * from './rigs';
export * from './envelopes';
export * from './protocols';
export * from './audit';
