// npm run fit -- marks.csv --mass-kg M --diameter-m D [...]
// Wiring only: the logic lives in shared/physics/fit-cli.ts.
import { readFileSync } from 'node:fs';
import { runFitCli } from '../../shared/physics/fit-cli';

const outcome = runFitCli(process.argv.slice(2), (path) => readFileSync(path, 'utf8'));
if (outcome.stdout) process.stdout.write(outcome.stdout);
if (outcome.stderr) process.stderr.write(outcome.stderr);
process.exitCode = outcome.exitCode;
