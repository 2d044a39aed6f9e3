#!/usr/bin/env node
// Launcher: runs the TypeScript CLI through tsx (a project dependency), no build step.
import { register } from 'tsx/esm/api';

register();
// A reader that stops early (`pulseloom generate … | head`) closes the pipe: that is a normal
// end for a command-line tool, not a crash.
process.stdout.on('error', (err) => {
  if (err.code === 'EPIPE') process.exit(0);
  throw err;
});
const { main } = await import('../lib/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
