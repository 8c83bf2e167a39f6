/** `node bin/drydig.js import …` as a process: what an AGS or DXF file holds, and one-line errors. */
import { execFile } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const repo = fileURLToPath(new URL('../..', import.meta.url));
const bin = path.join(repo, 'bin', 'drydig.js');

function drydig(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [bin, ...args], { cwd: repo, timeout: 60_000 }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
    });
  });
}

describe('node bin/drydig.js import', () => {
  it('prints the boreholes of an AGS file and the ground profile interpolated between two holes', async () => {
    const r = await drydig(['import', 'fixtures/imports/demo-site-investigation.ags', '--borehole', 'BH1,BH2', '--at', '389222.5,5819415']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.boreholes.map((b: { id: string }) => b.id)).toEqual(['BH1', 'BH2']);
    // Midpoint of BH1 (389205, 5819430) and BH2 (389240, 5819400): clay base (6.4 + 6.6)/2 = 6.5 m.
    expect(out.ground.layers[1].kind).toBe('plug');
    expect(out.ground.layers[1].bottom_m).toBeCloseTo(6.5, 9);
  }, 60_000);

  it('prints the layers of a DXF site plan', async () => {
    const r = await drydig(['import', 'fixtures/imports/demo-site-plan.dxf']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).layers.map((l: { name: string }) => l.name)).toContain('PIT');
  }, 60_000);

  it('answers a file of another kind with one line and exit code 2', async () => {
    const r = await drydig(['import', 'README.md']);
    expect(r.code).toBe(2);
    expect(r.stderr.trim()).toMatch(/^DRYDIG_ERR_CLI_USAGE: import: README.md: drydig reads .ags/);
  }, 60_000);
});
