import { formatIssues, type Result } from '../../core/result';
import type { ParsedArgs } from './args';
import { decisionSupportCaution } from './format';
import { exitCodes, type CliIo } from './io';

export const previewUsage = `Usage: chelation-ledger preview [<case.json>] [--port N] [--workspace DIR]

Serve the app in a browser on this computer only (127.0.0.1), with a token
that is new on every run; open the address it prints. --workspace is the
folder of case files (default: a copy of the demo cases in your settings
folder); a case file given instead opens in the page, with its folder as the
workspace. --port 1024–65535 (default: any free port). Ctrl+C stops it.`;

/** Starting the preview server: entry.ts hands in app/preview/runPreview.ts, tests a fake. */
export interface PreviewHostIo {
  readonly startPreview?: (options: { readonly port?: number; readonly workspace?: string; readonly openFile?: string }) => Promise<Result<{ readonly url: string }>>;
}

/** `preview [<case.json>] [--port N] [--workspace DIR]`: start the browser preview and print its address. */
export async function previewCommand(args: ParsedArgs, io: CliIo & PreviewHostIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(previewUsage);
    return exitCodes.ok;
  }
  const problems: string[] = [];
  for (const flag of Object.keys(args.options)) if (flag !== '--port' && flag !== '--workspace') problems.push(`${flag}: not an option of preview (--port, --workspace).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const openFile = args.positionals[0];
  if (args.positionals.length > 1) problems.push(`preview opens one case file; ${args.positionals.length} were given (${args.positionals.join(', ')}).`);
  else if (openFile !== undefined && !openFile.toLowerCase().endsWith('.json')) {
    problems.push(`${openFile}: preview opens a case file (.json); give a folder of case files as --workspace ${openFile}.`);
  } else if (openFile !== undefined && args.options['--workspace'] !== undefined) {
    problems.push(`give a case file or --workspace, not both: the case file's folder (of ${openFile}) becomes the workspace.`);
  }
  const portText = args.options['--port'];
  const port = portText === undefined ? undefined : Number(portText);
  if (port !== undefined && !(Number.isInteger(port) && port >= 1024 && port <= 65535)) {
    problems.push(`--port: "${portText}" is not a port this program may open; enter a whole number 1024–65535, or leave --port out.`);
  }
  if (problems.length > 0) {
    io.err(`${problems.join('\n')}\n\n${previewUsage}`);
    return exitCodes.usage;
  }
  if (!io.startPreview) {
    io.err('The preview cannot start from here.');
    return exitCodes.unexpected;
  }
  const workspace = args.options['--workspace'];
  const started = await io.startPreview({
    ...(port !== undefined ? { port } : {}),
    ...(workspace !== undefined ? { workspace } : {}),
    ...(openFile !== undefined ? { openFile } : {}),
  });
  if (!started.ok) {
    io.err(formatIssues(started.issues));
    return exitCodes.invalidInput;
  }
  io.out(`chelation-ledger preview: open ${started.value.url}`);
  io.out('Listening on this computer only (127.0.0.1). Press Ctrl+C to stop.');
  io.out(decisionSupportCaution);
  return exitCodes.ok;
}
