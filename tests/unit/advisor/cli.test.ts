import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

// Spawns the real CLI through tsx, as `npm run advise` does.
const root = join(__dirname, '../../..');
const examples = join(root, 'docs/examples');
const advise = (...args: string[]) =>
  spawnSync('npx', ['tsx', 'src/cli/advise.ts', ...args], {
    cwd: root,
    encoding: 'utf8',
    timeout: 60_000,
    maxBuffer: 64 * 1024 * 1024,
  });

const scratch = mkdtempSync(join(tmpdir(), 'lobewise-advise-'));
const write = (name: string, text: string) => {
  const p = join(scratch, name);
  writeFileSync(p, text);
  return p;
};

describe('npm run advise', () => {
  jest.setTimeout(120_000);

  it('prints the ranking JSON for the demo inputs and exits 0', () => {
    const r = advise('--build', join(examples, 'build-daily-truck.json'), '--cams', join(examples, 'cams.json'));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rankings.length).toBe(12);
    expect(out.rankings[0].rank).toBe(1);
    expect(out.rankings[0].curve.length).toBe(56);
    expect(out.baseline.camId).toBe('stock-5.3');
  });

  it('exits 2 naming the missing file', () => {
    const r = advise('--build', join(scratch, 'nope.json'), '--cams', join(examples, 'cams.json'));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/build: cannot read .*nope\.json \(ENOENT\)/);
    expect(r.stdout).toBe('');
  });

  it('exits 2 on a file that is not JSON', () => {
    const r = advise('--build', write('bad.json', '{ "engine": '), '--cams', join(examples, 'cams.json'));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/build: .*is not valid JSON/);
  });

  it('exits 2 with the field and the reason on a schema failure', () => {
    const cams = write(
      'cams.json',
      JSON.stringify([
        {
          id: 'x',
          name: 'x',
          intakeDuration050: 2120,
          exhaustDuration050: 218,
          intakeLiftIn: 0.55,
          exhaustLiftIn: 0.55,
          lsa: 113,
          intakeCenterline: 109,
        },
      ]),
    );
    const r = advise('--build', join(examples, 'build-street-car.json'), '--cams', cams);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('cams.0.intakeDuration050: intake duration at 0.050" must be at most 300 deg');
  });

  it('exits 2 when an argument is missing', () => {
    const r = advise('--build', join(examples, 'build-street-car.json'));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/cams: --cams <file> is required/);
  });
});
