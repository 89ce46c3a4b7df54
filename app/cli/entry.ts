import { writeCalendarOutput } from '../host/icalendar';
import { readCaseFile } from '../host/caseFiles';
import { availableParallelism, homedir } from 'node:os';
import { join } from 'node:path';
import { openCaseStore } from '../host/caseStore';
import { readTextFile } from '../host/textFiles';
import { userConfigFolder } from '../host/userFolders';
import { workspaceWorkersFrom } from '../host/workspaceReview';
import { runPreview } from '../preview/runPreview';
import { runAtBoundary } from './boundary';
import { runCli, type CliHostIo } from './main';

// The process boundary: the only place the command line touches process.
// A reader that stops early (`… | head`) closes the pipe: stop quietly, with no trace.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}
const io: CliHostIo = {
  out: (text) => process.stdout.write(`${text}\n`),
  err: (text) => process.stderr.write(`${text}\n`),
  readCase: readCaseFile,
  readText: readTextFile,
  // The host may read the clock; core never does. Local calendar date of this desktop.
  today: () => {
    const now = new Date();
    return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
  },
  now: () => new Date(),
  writeCalendar: writeCalendarOutput,
  startPreview: (options) => {
    // dist/cli.cjs sits in <app folder>/dist.
    const appFolder = join(__dirname, '..');
    const { name, version } = require(join(appFolder, 'package.json')) as { name: string; version: string };
    return runPreview({ appName: name, appVersion: version, appFolder, configFolder: userConfigFolder(process.env, process.platform, homedir()), ...options });
  },
  openStore: (folder) => openCaseStore(folder),
  // One thread per core but one for a workspace review (CHELATION_LEDGER_WORKERS overrides); the worker script is built beside dist/cli.cjs.
  workspaceWorkers: () => workspaceWorkersFrom(process.env, availableParallelism(), join(__dirname, 'workspaceWorker.cjs')),
};

void runAtBoundary(process.argv.slice(2), io, (argv) => runCli(argv, io)).then((code) => {
  process.exitCode = code;
});
