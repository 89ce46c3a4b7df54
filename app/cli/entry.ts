import { runCli } from './main';

// The process boundary: the only place the command line touches process.
const code = runCli(process.argv.slice(2), {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
});
process.exitCode = code;
