// `npm start` (and `npm run preview` with --preview): build what the app needs,
// then launch the desktop app where Electron's binary is present, else say so
// in one line and start the browser preview, which prints its address.
// The electron module is never loaded here: loading it without its binary
// starts a download (stack-notes.md); its path.txt is read instead.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildCli } from './build-cli.mjs';
import { buildDesktop } from './build-desktop.mjs';

const root = fileURLToPath(new URL('../..', import.meta.url));
const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));
const args = process.argv.slice(2);
const previewOnly = args[0] === '--preview';
const rest = previewOnly ? args.slice(1) : args;
// npm runs scripts in the project folder and names the folder it was called from in INIT_CWD: a case
// file given as `npm start -- ../cases/ab-0001.json` is read from there, as the user meant it. The app
// and the preview find their own files from where they are installed, not from the working folder.
const callerFolder = process.env.INIT_CWD ?? process.cwd();

/** The Electron binary installed with the electron package, or null when it was never downloaded. */
export function electronBinary(projectRoot = root) {
  const pathFile = join(projectRoot, 'node_modules', 'electron', 'path.txt');
  if (!existsSync(pathFile)) return null;
  const binary = join(projectRoot, 'node_modules', 'electron', 'dist', readFileSync(pathFile, 'utf8').trim());
  return existsSync(binary) ? binary : null;
}

function run(child) {
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
  child.on('exit', (code) => process.exit(code ?? 0));
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildCli();
  await buildDesktop();
  if (pkg.scripts?.['build:renderer']) {
    const built = spawnSync('npm', ['run', '--silent', 'build:renderer'], { cwd: root, stdio: 'inherit' });
    if (built.status !== 0) process.exit(built.status ?? 1);
  } else {
    console.log('The screens are not part of this build yet (no build:renderer script); the host calls still answer.');
  }
  const electron = previewOnly ? null : electronBinary();
  if (electron) {
    run(spawn(electron, [root, ...rest], { cwd: callerFolder, stdio: 'inherit' }));
  } else {
    if (!previewOnly) console.log("Electron's binary is not installed on this machine (it could not be downloaded), so the app opens in your browser instead:");
    run(spawn(process.execPath, [join(root, 'dist', 'cli.cjs'), 'preview', ...rest], { cwd: callerFolder, stdio: 'inherit' }));
  }
}
