import { formatIssues, type Result } from '../../core/result';
import type { ParsedArgs } from './args';
import { decisionSupportCaution } from './format';
import { exitCodes, type CliIo } from './io';

export const previewUsage = `Usage: chelation-ledger preview [--port N] [--workspace DIR]

Serve the app in a browser on this computer only (127.0.0.1), with a token
that is new on every run; open the address it prints. --workspace is the
folder of case files (default: a copy of the demo cases in your settings
folder); --port 1024–65535 (default: any free port). Ctrl+C stops it.`;

/** Starting the preview server: entry.ts hands in app/preview/runPreview.ts, tests a fake. */
export interface PreviewHostIo {
  readonly startPreview?: (options: { readonly port?: number; readonly workspace?: string }) => Promise<Result<{ readonly url: string }>>;
}

/** `preview [--port N] [--workspace DIR]`: start the browser preview and print its address. */
export async function previewCommand(args: ParsedArgs, io: CliIo & PreviewHostIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(previewUsage);
    return exitCodes.ok;
  }
  const problems: string[] = [];
  for (const flag of Object.keys(args.options)) if (flag !== '--port' && flag !== '--workspace') problems.push(`${flag}: not an option of preview (--port, --workspace).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  if (args.positionals.length > 0) problems.push(`preview takes no file; give the workspace folder as --workspace ${args.positionals[0]}.`);
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
  const started = await io.startPreview({ ...(port !== undefined ? { port } : {}), ...(workspace !== undefined ? { workspace } : {}) });
  if (!started.ok) {
    io.err(formatIssues(started.issues));
    return exitCodes.invalidInput;
  }
  io.out(`chelation-ledger preview: open ${started.value.url}`);
  io.out('Listening on this computer only (127.0.0.1). Press Ctrl+C to stop.');
  io.out(decisionSupportCaution);
  return exitCodes.ok;
}
