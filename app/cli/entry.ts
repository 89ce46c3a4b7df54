import { readCaseFile } from '../host/caseFiles';
import { runCli } from './main';

// The process boundary: the only place the command line touches process.
const code = runCli(process.argv.slice(2), {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
  readCase: readCaseFile,
  // The host may read the clock; core never does. Local calendar date of this desktop.
  today: () => {
    const now = new Date();
    return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
  },
});
process.exitCode = code;
