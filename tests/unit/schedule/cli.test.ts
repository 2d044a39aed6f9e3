/** End-to-end: the `pulseloom` launcher in bin/, run as a child process like a lab script would. */
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { generateSchedule, type Spec } from '../../../lib/schedule/index';

const run = promisify(execFile);
const root = fileURLToPath(new URL('../../../', import.meta.url));
const bin = join(root, 'bin/pulseloom.mjs');
const examples = join(root, 'lib/schedule/examples');
const dir = mkdtempSync(join(tmpdir(), 'pulseloom-cli-'));

async function cli(...args: string[]) {
  try {
    const r = await run(process.execPath, [bin, ...args], { cwd: root, maxBuffer: 64 << 20 });
    return { code: 0, stdout: r.stdout, stderr: r.stderr };
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string };
    return { code: err.code, stdout: err.stdout, stderr: err.stderr };
  }
}

describe('pulseloom CLI', { timeout: 60_000 }, () => {
  const specPath = join(examples, 'optical-ramp-sine.json');
  const spec = JSON.parse(readFileSync(specPath, 'utf8')) as Spec;

  it('ends quietly with exit 0 when the reader closes the pipe early (generate | head)', async () => {
    const script = `"${process.execPath}" "${bin}" generate --csv "${specPath}" | head -n 2; echo "status=\${PIPESTATUS[0]}"`;
    const r = await run('bash', ['-c', script], { cwd: root });
    expect(r.stdout).toContain('# format: pulseloom-schedule/1');
    expect(r.stdout).toContain('status=0');
    expect(r.stderr).not.toMatch(/EPIPE|Error/);
  });

  it('generate prints the schedule JSON; verify accepts it (exit 0); a moved pulse fails with the first difference (exit 1)', async () => {
    const g = await cli('generate', specPath, '--meta', 'protocol=vole-place-cells');
    expect(g.code).toBe(0);
    const doc = JSON.parse(g.stdout);
    const expected = generateSchedule(spec);
    expect(doc.format).toBe('pulseloom-schedule/1');
    expect(doc.meta).toEqual({ protocol: 'vole-place-cells' });
    expect(doc.manifest).toEqual(expected.manifest);
    expect(doc.trials[3].onsetsS).toEqual(expected.trials[3].onsetsS);

    const good = join(dir, 'schedule.json');
    writeFileSync(good, g.stdout);
    const ok = await cli('verify', good);
    expect(ok.code).toBe(0);
    expect(ok.stdout).toMatch(/OK — \d+ pulses, sha256:[0-9a-f]{64}/);

    doc.trials[3].onsetSamples[7] += 1;
    const bad = join(dir, 'tampered.json');
    writeFileSync(bad, JSON.stringify(doc));
    const no = await cli('verify', bad);
    expect(no.code).toBe(1);
    expect(no.stderr).toMatch(/DIFFERENT — trial 3, pulse 7: file onset_sample \d+, regenerated \d+/);
  });

  it('generate --csv prints CSV that verify accepts; byte-identical across runs', async () => {
    const a = await cli('generate', join(examples, 'electrical-biphasic.json'), '--csv', '--preview');
    const b = await cli('generate', join(examples, 'electrical-biphasic.json'), '--csv', '--preview');
    expect(a.code).toBe(0);
    expect(a.stdout).toBe(b.stdout);
    expect(a.stdout.split('\n')[0]).toBe('# PREVIEW — NOT APPROVED FOR USE');
    const file = join(dir, 'schedule.csv');
    writeFileSync(file, a.stdout);
    expect((await cli('verify', file)).code).toBe(0);
  });

  it('an invalid spec exits 2 and lists every problem with its JSON path', async () => {
    const broken = structuredClone(spec) as any;
    broken.trials = 5000;
    broken.envelope[2].depthHz = 20;
    const p = join(dir, 'broken.json');
    writeFileSync(p, JSON.stringify(broken));
    const r = await cli('generate', p);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/  trials: more than 1000 trials/);
    expect(r.stderr).toMatch(/  envelope\[2\]: sine dips to -10 Hz/);
    expect(r.stdout).toBe('');
  });

  it('--help works and an unknown command is a usage error', async () => {
    const h = await cli('--help');
    expect(h.code).toBe(0);
    expect(h.stdout).toMatch(/pulseloom generate <spec\.json>/);
    expect((await cli('frobnicate')).code).toBe(2);
  });
});
