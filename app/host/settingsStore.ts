import { mkdirSync, readFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { defaultSettings, settingsSchema, type Settings } from '../../core/contract/settings';
import { issuesFromZod } from '../../core/model/zodIssues';
import { fail, issue, ok, type Result } from '../../core/result';
import { writeFileAtomic } from './atomicWrite';

const words = { root: 'The settings file', fieldOf: 'the settings' };

/**
 * The user's settings as one JSON file at a path the host hands in (Electron:
 * the user-data folder; the preview: --config or the XDG config folder; tests:
 * a temporary folder). A missing file reads as the defaults; a file that fails
 * the schema is reported and left as it is, never rewritten behind the user.
 */
export interface SettingsStore {
  read(): Result<Settings>;
  write(settings: Settings): Promise<Result<Settings>>;
}

export function createSettingsStore(settingsPath: string): SettingsStore {
  return {
    read() {
      let text: string;
      try {
        text = readFileSync(settingsPath, 'utf8');
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return ok(defaultSettings);
        return fail(issue('invalid_file', [], `Cannot read the settings file ${settingsPath}: ${(error as Error).message}.`));
      }
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch (error) {
        return fail(issue('invalid_file', [], `The settings file ${settingsPath} is not valid JSON: ${(error as Error).message}.`));
      }
      const parsed = settingsSchema.safeParse(json, { reportInput: true });
      return parsed.success ? ok(parsed.data) : fail(...issuesFromZod(parsed.error.issues, 'error', words));
    },
    async write(settings) {
      const parsed = settingsSchema.safeParse(settings, { reportInput: true });
      if (!parsed.success) return fail(...issuesFromZod(parsed.error.issues, 'error', words));
      try {
        mkdirSync(dirname(settingsPath), { recursive: true });
      } catch (error) {
        return fail(issue('write_failed', [], `Cannot make the settings folder ${dirname(settingsPath)}: ${(error as Error).message}; the settings were not changed.`));
      }
      // app/host/atomicWrite.ts: a crash leaves the old file or the new one, never half of either.
      const written = await writeFileAtomic(settingsPath, `${JSON.stringify(parsed.data, null, 2)}\n`);
      return written.ok ? ok(parsed.data) : written;
    },
  };
}
