import { copyFileSync, existsSync, mkdirSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fail, issue, ok, type Result } from '../../core/result';

/**
 * The workspace a first run opens: a copy of the invented demo cases in the
 * user's own folder, so saving in the app never changes the files shipped
 * with it. Made once; an existing folder is used as it is (the user's edits
 * of the demo cases are kept).
 *
 * @param targetFolder - e.g. <user config folder>/demo-workspace
 * @param demoSource - the shipped demo cases (assets/demo, or dist/demo when packaged)
 * @returns the workspace folder
 */
export function ensureDemoWorkspace(targetFolder: string, demoSource: string): Result<string> {
  if (existsSync(targetFolder)) return ok(targetFolder);
  try {
    mkdirSync(targetFolder, { recursive: true });
    for (const name of readdirSync(demoSource)) {
      if (name.endsWith('.json')) copyFileSync(join(demoSource, name), join(targetFolder, name));
    }
  } catch (error) {
    return fail(issue('write_failed', ['workspace'], `Cannot make the demo workspace ${targetFolder}: ${(error as Error).message}.`));
  }
  return ok(targetFolder);
}
