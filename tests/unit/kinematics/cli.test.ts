import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { sweepCommand } from '../../../shared/cli/sweep';
import { heaveRowsCsv, runSweep } from '../../../shared/kinematics';
import { checkSketch, layouts } from '../../../shared/schema/sketch';
import { exampleSketch } from './helpers';
import { badInputCases } from '../schema/badInputCases';

const dir = mkdtempSync(path.join(tmpdir(), 'arcwright-sweep-'));
const write = (name: string, text: string) => {
  writeFileSync(path.join(dir, name), text);
  return name;
};
const good = write('good.json', JSON.stringify(exampleSketch()));

describe('sweep command', () => {
  it('prints the sweep result as JSON and exits 0', () => {
    const out = sweepCommand([good], dir);
    expect(out.code).toBe(0);
    expect(out.stderr).toBeUndefined();
    expect(JSON.parse(out.stdout!)).toEqual(JSON.parse(JSON.stringify(runSweep(exampleSketch()))));
  });

  it('prints the heave rows as CSV with --csv', () => {
    const out = sweepCommand([good, '--csv'], dir);
    expect(out.code).toBe(0);
    const lines = out.stdout!.trimEnd().split('\r\n');
    expect(lines).toHaveLength(1 + 49);
    const header = lines[0].split(',');
    expect(header.slice(0, 2)).toEqual(['travel', 'pose.x']);
    expect(header).toContain('members.SPl.wheelRate');
    expect(header).toContain('driveline.pinionAngle');
    expect(lines[1].split(',')[0]).toBe('-130');
    expect(lines.every((l) => l.split(',').length === header.length)).toBe(true);
  });

  it('refuses bad input with one line per problem and nothing on stdout', () => {
    const cases: [string[], RegExp][] = [
      [['missing.json'], /^missing\.json: no such file$/],
      [[write('text.json', 'not json at all')], /^text\.json: not JSON/],
      [
        [write('bad.json', JSON.stringify({ ...exampleSketch(), points: 'none' }))],
        /^bad\.json: points: expected a list$/,
      ],
      [[], /^no sketch file given$/],
      [[good, '--xml'], /^unknown option '--xml'$/],
    ];
    for (const [args, first] of cases) {
      const out = sweepCommand(args, dir);
      expect(out.code).toBe(2);
      expect(out.stdout).toBeUndefined();
      expect(out.stderr![0]).toMatch(first);
    }
    const many = sweepCommand([write('many.json', JSON.stringify({ ...exampleSketch(), name: 3, layout: 'x' }))], dir);
    expect(many.stderr).toEqual([
      'many.json: name: expected a string',
      expect.stringMatching(/^many\.json: layout: expected one of/),
    ]);
  });

  for (const [i, c] of badInputCases.entries()) {
    it(`refuses ${c.name} with exit 2, naming the field`, () => {
      const file = write(`fault-${i}.json`, JSON.stringify(c.doc()));
      const out = sweepCommand([file], dir);
      expect(out.code).toBe(2);
      expect(out.stdout).toBeUndefined();
      expect(out.stderr).toContain(`${file}: ${c.problem}`);
    });
  }

  it('behaves the same as a process: exit code 2, no stack trace, empty stdout', () => {
    const root = path.resolve(__dirname, '../../..');
    const run = spawnSync(
      process.execPath,
      [path.join(root, 'node_modules/tsx/dist/cli.mjs'), path.join(root, 'shared/cli/sweep.ts'), 'missing.json'],
      {
        cwd: dir,
        encoding: 'utf8',
        env: { ...process.env, INIT_CWD: dir },
      },
    );
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe('missing.json: no such file\n');
    const ok = spawnSync(
      process.execPath,
      [path.join(root, 'node_modules/tsx/dist/cli.mjs'), path.join(root, 'shared/cli/sweep.ts'), good, '--csv'],
      {
        cwd: dir,
        encoding: 'utf8',
        env: { ...process.env, INIT_CWD: dir },
      },
    );
    expect(ok.status).toBe(0);
    expect(ok.stdout).toBe(heaveRowsCsv(runSweep(exampleSketch())));
  }, 30000);
});

describe('sweep command: the steer sweep', () => {
  it('prints the steer sweep of a steered starter, and of a layout that does not steer a warning naming sweep.steer', () => {
    const starter = sweepCommand(['--starter', 'double-wishbone'], dir);
    const steered = JSON.parse(sweepCommand([write('steered.json', starter.stdout!)], dir).stdout!);
    expect(steered.steer.rows).toHaveLength(25);
    expect(steered.steer.events.map((e: { kind: string }) => e.kind)).toEqual(['steer-lock', 'steer-lock']);
    const rigid = write('rigid.json', JSON.stringify({ ...exampleSketch(), sweep: { steer: { rack: 40, step: 5 } } }));
    const out = sweepCommand([rigid], dir);
    expect(out.code).toBe(0);
    const result = JSON.parse(out.stdout!);
    expect(result.heave.length).toBeGreaterThan(0);
    expect(result.roll.length).toBeGreaterThan(0);
    expect(result.warnings).toContain(result.steer.problem);
    expect(result.steer.problem).toMatch(/^sweep\.steer: /);
  });

  it('prints the steered front axle starter, sweeps its pitman arm, and names a missing box pivot', () => {
    const starter = sweepCommand(['--starter', 'steered-front-axle'], dir);
    expect(starter.code).toBe(0);
    const doc = JSON.parse(starter.stdout!);
    const steered = JSON.parse(sweepCommand([write('front-axle.json', starter.stdout!)], dir).stdout!);
    expect(steered.steer.input).toBe('pitman');
    expect(steered.steer.rows.map((r: { pitman: number }) => r.pitman).slice(0, 2)).toEqual([-35, -32.5]);
    const noPivot = write('no-pivot.json', JSON.stringify({ ...doc, pitmanArm: { axis: 'SB.a', ball: 'PM.b' } }));
    const out = sweepCommand([noPivot], dir);
    expect(out.code).toBe(0);
    const result = JSON.parse(out.stdout!);
    expect(result.heave).toEqual(steered.heave);
    expect(result.roll).toEqual(steered.roll);
    expect(result.steer.problem).toMatch(/^pitmanArm\.pivot: /);
    expect(result.warnings).toContain(result.steer.problem);
  });

  it('refuses a bad rack step with exit 2 and the field named', () => {
    const bad = write(
      'bad-steer.json',
      JSON.stringify({ ...exampleSketch(), sweep: { steer: { rack: 40, step: -1 } } }),
    );
    const out = sweepCommand([bad], dir);
    expect(out.code).toBe(2);
    expect(out.stdout).toBeUndefined();
    expect(out.stderr).toEqual(['bad-steer.json: sweep.steer.step: must be greater than 0']);
  });
});

describe('sweep command: --starter', () => {
  it('prints a valid sketch file of the asked layout for every layout with a starter, and exits 0', () => {
    const withStarter = ['four-link-lateral-rod', 'leaf-spring', 'double-wishbone'];
    for (const layout of withStarter) {
      const out = sweepCommand(['--starter', layout], dir);
      expect(out.code, layout).toBe(0);
      expect(out.stderr).toBeUndefined();
      const file = JSON.parse(out.stdout!);
      expect(file.layout).toBe(layout);
      // The printed file is a sketch the command itself accepts: written to disk and swept back.
      const name = write(`${layout}.json`, out.stdout!);
      expect(sweepCommand([name], dir).code).toBe(0);
      expect(checkSketch(file).ok).toBe(true);
    }
  });

  it('refuses an unknown layout with exit 2, naming the layouts there are', () => {
    const out = sweepCommand(['--starter', 'pogo-stick'], dir);
    expect(out.code).toBe(2);
    expect(out.stdout).toBeUndefined();
    expect(out.stderr!.join('\n')).toContain("'pogo-stick'");
    for (const layout of ['four-link-lateral-rod', 'trailing-arm', 'leaf-spring']) {
      expect(layouts).toContain(layout);
      expect(out.stderr!.join('\n')).toContain(layout);
    }
  });

  it('refuses --starter without a layout, or with a sketch file beside it', () => {
    expect(sweepCommand(['--starter'], dir).code).toBe(2);
    expect(sweepCommand(['--starter', 'leaf-spring', good], dir).code).toBe(2);
  });
});
