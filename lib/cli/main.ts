/**
 * `pulseloom` command line: generate a schedule from a spec, verify a schedule file.
 * Exit codes: 0 success, 1 verification found a difference, 2 bad usage or invalid spec.
 */
import { readFileSync } from 'node:fs';
import type { Writable } from 'node:stream';
import {
  csvBytes,
  jsonBytes,
  parseSpec,
  verifySchedule,
  type ScheduleMeta,
} from '../schedule/index';

const USAGE = `pulseloom — seeded random-timing stimulation schedules

Usage:
  pulseloom generate <spec.json> [--csv] [--preview] [--meta key=value]...
      Print the schedule for a pulseloom-spec/1 file to stdout: JSON
      (format pulseloom-schedule/1, with manifest and trials[i].onsetsS),
      or CSV with --csv. --preview marks a draft: PREVIEW — NOT APPROVED FOR USE.
      --meta adds descriptive fields (e.g. --meta protocol=grid-A --meta channel=2).
  pulseloom check <spec.json>
      Validate a spec; print every problem with its JSON path.
  pulseloom verify <schedule.json|schedule.csv>
      Regenerate from the file's manifest; exit 0 when every pulse and the
      checksum match, 1 with the first difference otherwise.
  pulseloom --help

A spec path of "-" reads stdin.`;

export interface CliIo {
  stdout: Writable;
  stderr: Writable;
  readText: (path: string) => string;
}

const defaultIo = (): CliIo => ({
  stdout: process.stdout,
  stderr: process.stderr,
  readText: (p) => readFileSync(p === '-' ? 0 : p, 'utf8'),
});

export async function main(argv: string[], io: CliIo = defaultIo()): Promise<number> {
  const [cmd, ...rest] = argv;
  if (!cmd || cmd === '--help' || cmd === '-h' || cmd === 'help') {
    await write(io.stdout, USAGE + '\n');
    return cmd ? 0 : 2;
  }
  try {
    if (cmd === 'generate') return await generate(rest, io);
    if (cmd === 'check') return await check(rest, io);
    if (cmd === 'verify') return await verify(rest, io);
  } catch (err) {
    await write(io.stderr, `pulseloom: ${err instanceof Error ? err.message : String(err)}\n`);
    return 2;
  }
  await write(io.stderr, `pulseloom: unknown command "${cmd}"\n\n${USAGE}\n`);
  return 2;
}

interface GenerateArgs {
  path: string;
  csv: boolean;
  meta: ScheduleMeta;
}

function parseGenerateArgs(args: string[]): GenerateArgs | string {
  let path: string | undefined;
  let csv = false;
  const meta: ScheduleMeta = {};
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === '--csv') csv = true;
    else if (a === '--preview') meta.preview = true;
    else if (a === '--meta') {
      const kv = args[++i];
      const eq = kv?.indexOf('=') ?? -1;
      if (!kv || eq < 1) return '--meta needs key=value';
      meta[kv.slice(0, eq)] = kv.slice(eq + 1);
    } else if (a.startsWith('--')) return `unknown option ${a}`;
    else if (path === undefined) path = a;
    else return `unexpected argument ${a}`;
  }
  if (path === undefined) return 'generate needs a spec file';
  return { path, csv, meta };
}

function readSpec(path: string, io: CliIo) {
  let raw: unknown;
  try {
    raw = JSON.parse(io.readText(path));
  } catch (err) {
    return { ok: false as const, errors: [{ path: '$', message: `cannot read ${path} as JSON: ${(err as Error).message}` }] };
  }
  return parseSpec(raw);
}

async function printErrors(io: CliIo, path: string, errors: { path: string; message: string }[]) {
  await write(io.stderr, `${path}: ${errors.length} problem${errors.length === 1 ? '' : 's'}\n`);
  for (const e of errors) await write(io.stderr, `  ${e.path}: ${e.message}\n`);
}

async function generate(args: string[], io: CliIo): Promise<number> {
  const a = parseGenerateArgs(args);
  if (typeof a === 'string') {
    await write(io.stderr, `pulseloom generate: ${a}\n`);
    return 2;
  }
  const r = readSpec(a.path, io);
  if (!r.ok) {
    await printErrors(io, a.path, r.errors);
    return 2;
  }
  const chunks = a.csv ? csvBytes(r.spec, a.meta) : jsonBytes(r.spec, a.meta);
  await pipeChunks(chunks, io.stdout);
  return 0;
}

async function check(args: string[], io: CliIo): Promise<number> {
  if (args.length !== 1) {
    await write(io.stderr, 'pulseloom check: needs exactly one spec file\n');
    return 2;
  }
  const r = readSpec(args[0], io);
  if (!r.ok) {
    await printErrors(io, args[0], r.errors);
    return 2;
  }
  await write(io.stdout, `${args[0]}: valid ${r.spec.format}\n`);
  return 0;
}

async function verify(args: string[], io: CliIo): Promise<number> {
  if (args.length !== 1) {
    await write(io.stderr, 'pulseloom verify: needs exactly one schedule file\n');
    return 2;
  }
  const r = verifySchedule(io.readText(args[0]));
  if (!r.ok) {
    await write(io.stderr, `${args[0]}: DIFFERENT — ${r.firstDifference}\n`);
    return 1;
  }
  await write(io.stdout, `${args[0]}: OK — ${r.pulses} pulses, ${r.checksum}\n`);
  if (r.preview) await write(io.stderr, `${args[0]}: note — this file is a PREVIEW — NOT APPROVED FOR USE\n`);
  return 0;
}

/**
 * Write chunks in order, each only after the previous one is handed on. Waiting for the
 * write callback (not just `drain`) matters: a sink that completes synchronously defers
 * its bookkeeping to process.nextTick, which a tight await loop would starve, and the
 * written chunks would pile up in memory.
 */
export async function pipeChunks(chunks: Iterable<string | Uint8Array>, out: Writable): Promise<void> {
  for (const c of chunks) await write(out, c);
}

function write(out: Writable, text: string | Uint8Array): Promise<void> {
  return new Promise((resolve, reject) => {
    out.write(text, (err) => (err ? reject(err) : resolve()));
  });
}
