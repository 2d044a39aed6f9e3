#!/usr/bin/env node
// Launcher: runs the TypeScript CLI through tsx (a project dependency), no build step.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../lib/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
