// npm run advise -- --build <build.json> --cams <cams.json> [--history <history.json>] [--no-curves]
// Prints the ranking as JSON on stdout. Bad input exits 2 with the field and the reason on stderr.
import { readFileSync } from 'node:fs';
import { rankCams, type HistoryEntry } from '../lib/advisor';
import { BuildProfileSchema } from '../lib/schemas/build-profile';
import { CamCatalogueSchema } from '../lib/schemas/cam-card';
import { formatZodIssues, type FieldIssue } from '../lib/schemas/errors';

const USAGE =
  'usage: npm run advise -- --build <build.json> --cams <cams.json> [--history <history.json>] [--no-curves]';

class InputError extends Error {
  constructor(readonly issues: FieldIssue[]) {
    super(issues.map((i) => `${i.field}: ${i.message}`).join('\n'));
  }
}

type Args = { build?: string; cams?: string; history?: string; curves: boolean };

function parseArgs(argv: string[]): Args {
  const args: Args = { curves: true };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--no-curves') args.curves = false;
    else if (a === '--build' || a === '--cams' || a === '--history') {
      const v = argv[++i];
      if (v === undefined || v.startsWith('--'))
        throw new InputError([{ field: a.slice(2), message: `${a} needs a file path` }]);
      args[a.slice(2) as 'build' | 'cams' | 'history'] = v;
    } else throw new InputError([{ field: '(arguments)', message: `unknown argument ${JSON.stringify(a)}` }]);
  }
  const missing = (['build', 'cams'] as const).filter((k) => args[k] === undefined);
  if (missing.length) throw new InputError(missing.map((k) => ({ field: k, message: `--${k} <file> is required` })));
  return args;
}

function readJsonFile(label: string, path: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code ?? 'unreadable';
    throw new InputError([{ field: label, message: `cannot read ${path} (${code})` }]);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new InputError([{ field: label, message: `${path} is not valid JSON (${(e as Error).message})` }]);
  }
}

// History is optional and only lightly checked: the advisor ignores records it cannot use.
function readHistory(path: string): HistoryEntry[] {
  const value = readJsonFile('history', path);
  if (!Array.isArray(value))
    throw new InputError([{ field: 'history', message: 'must be a JSON array of past results' }]);
  return value.filter((h): h is HistoryEntry => typeof h === 'object' && h !== null && 'camId' in h);
}

function main(argv: string[]): number {
  try {
    const args = parseArgs(argv);
    const buildRaw = readJsonFile('build', args.build as string);
    const camsRaw = readJsonFile('cams', args.cams as string);
    const build = BuildProfileSchema.safeParse(buildRaw);
    const cams = CamCatalogueSchema.safeParse(camsRaw);
    const issues = [
      ...(build.success ? [] : formatZodIssues(build.error, 'build')),
      ...(cams.success ? [] : formatZodIssues(cams.error, 'cams')),
    ];
    if (issues.length || !build.success || !cams.success) throw new InputError(issues);
    const history = args.history ? readHistory(args.history) : undefined;
    const result = rankCams(build.data, cams.data, { history, includeCurves: args.curves });
    process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
    return 0;
  } catch (e) {
    if (e instanceof InputError) {
      process.stderr.write(`advise: bad input\n${e.message}\n${USAGE}\n`);
      return 2;
    }
    process.stderr.write(`advise: unexpected error: ${(e as Error).stack ?? String(e)}\n`);
    return 1;
  }
}

process.exitCode = main(process.argv.slice(2));
