// The preview server (app/preview) as a process of its own, for tests/e2e/browser.ts
// `startPreviewProcess`: bundled with esbuild and run with node, it prints the page's address
// on its first line and serves until it is ended. Arguments: the built renderer folder, the
// workspace folder, the config folder.
import { runPreview } from '../../app/preview/runPreview';

const [rendererFolder, workspace, configFolder] = process.argv.slice(2);
if (!rendererFolder || !workspace || !configFolder) throw new Error('usage: previewProcess <renderer folder> <workspace> <config folder>');
void runPreview({ appName: 'chelation-ledger', appVersion: '0.0.0-e2e', appFolder: process.cwd(), configFolder, workspace, rendererFolder }).then((started) => {
  if (!started.ok) {
    process.stderr.write(`${started.issues.map((it) => it.message).join('; ')}\n`);
    process.exit(1);
  }
  process.stdout.write(`${started.value.url}\n`);
});
