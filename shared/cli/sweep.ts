/**
 * `npm run sweep -- path/to/sketch.json [--csv]`
 * Prints the sweep result as JSON (or the heave rows as CSV) on stdout and exits 0, always in the
 * file's units (mm, degrees, %, N/mm, N, N·m) whatever unit system the board shows.
 * `npm run sweep -- --starter <layout>` prints that layout's starter sketch file instead, so a
 * user can begin from a file; an unknown layout exits 2 naming the layouts there are.
 * Bad input (unreadable file, not JSON, schema problems) exits 2 with one line per problem
 * on stderr and nothing on stdout. Never a stack trace.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { isSketchValidationError } from '../schema/errors';
import { heaveRowsCsv, runSweep, starters } from '../kinematics';

const EXIT_OK = 0;
const EXIT_INTERNAL = 1;
const EXIT_BAD_INPUT = 2;
const USAGE = 'usage: npm run sweep -- path/to/sketch.json [--csv]   or   npm run sweep -- --starter <layout>';
const STARTER_OPTION = '--starter';

interface CliOutcome {
  code: number;
  stdout?: string;
  stderr?: string[];
}

/** The whole command as a function of its arguments and working directory (tested without a process). */
export function sweepCommand(args: string[], cwd: string): CliOutcome {
  if (args.includes(STARTER_OPTION)) return starterCommand(args);
  const csv = args.includes('--csv');
  const unknown = args.filter((a) => a.startsWith('--') && a !== '--csv');
  const files = args.filter((a) => !a.startsWith('--'));
  if (unknown.length > 0)
    return { code: EXIT_BAD_INPUT, stderr: [...unknown.map((a) => `unknown option '${a}'`), USAGE] };
  if (files.length !== 1)
    return {
      code: EXIT_BAD_INPUT,
      stderr: [files.length === 0 ? 'no sketch file given' : 'give exactly one sketch file', USAGE],
    };
  const file = files[0];
  let text: string;
  try {
    text = readFileSync(path.resolve(cwd, file), 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'is a directory'
          : code === 'EACCES'
            ? 'permission denied'
            : 'cannot be read';
    return { code: EXIT_BAD_INPUT, stderr: [`${file}: ${why}`] };
  }
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    return { code: EXIT_BAD_INPUT, stderr: [`${file}: not JSON (${(e as Error).message.split('\n')[0]})`] };
  }
  try {
    const result = runSweep(doc);
    return { code: EXIT_OK, stdout: csv ? heaveRowsCsv(result) : `${JSON.stringify(result, null, 2)}\n` };
  } catch (e) {
    if (isSketchValidationError(e)) return { code: EXIT_BAD_INPUT, stderr: e.problems.map((p) => `${file}: ${p}`) };
    return {
      code: EXIT_INTERNAL,
      stderr: [`${file}: internal error in the sweep (${(e as Error)?.message ?? String(e)})`],
    };
  }
}

/** `--starter <layout>`: the starter's sketch file with its default parameters, as JSON. */
function starterCommand(args: string[]): CliOutcome {
  const known = Object.keys(starters).join(', ');
  const at = args.indexOf(STARTER_OPTION);
  const layout = args[at + 1];
  if (args.length !== 2 || at !== 0)
    return {
      code: EXIT_BAD_INPUT,
      stderr: [`give ${STARTER_OPTION} a layout and nothing else (one of ${known})`, USAGE],
    };
  const spec = Object.entries(starters).find(([name]) => name === layout)?.[1];
  if (!spec) return { code: EXIT_BAD_INPUT, stderr: [`no starter for layout '${layout}': the layouts are ${known}`] };
  return { code: EXIT_OK, stdout: `${JSON.stringify(spec.build(), null, 2)}\n` };
}

function main(): void {
  // npm runs scripts from the package root; INIT_CWD is where the user typed the command.
  const cwd = process.env.INIT_CWD ?? process.cwd();
  let outcome: CliOutcome;
  try {
    outcome = sweepCommand(process.argv.slice(2), cwd);
  } catch (e) {
    outcome = { code: EXIT_INTERNAL, stderr: [`internal error (${(e as Error)?.message ?? String(e)})`] };
  }
  // A reader that stops early (`| head`) closes the pipe: that is not an error of ours.
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code !== 'EPIPE') process.stderr.write(`cannot write the result (${e.message})\n`);
    process.exitCode = e.code === 'EPIPE' ? outcome.code : EXIT_INTERNAL;
  });
  if (outcome.stdout) process.stdout.write(outcome.stdout);
  if (outcome.stderr) process.stderr.write(outcome.stderr.map((l) => `${l}\n`).join(''));
  // exitCode rather than exit(): lets a large stdout drain into a pipe before the process ends.
  process.exitCode = outcome.code;
}

const invokedDirectly = process.argv[1] !== undefined && /sweep\.ts$/.test(process.argv[1]);
if (invokedDirectly) main();
