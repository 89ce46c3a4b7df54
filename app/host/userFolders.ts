import { join } from 'node:path';

/** The folder name of our own per-user files (settings, the demo workspace). */
export const appFolderName = 'chelation-ledger';

/**
 * The per-user folder for the app's settings, where Electron's
 * `app.getPath('userData')` also puts it, so the desktop app and the preview
 * share one settings file: `%APPDATA%` on Windows, `~/Library/Application
 * Support` on macOS, `$XDG_CONFIG_HOME` or `~/.config` elsewhere (Electron
 * documentation, "app.getPath", appData; XDG Base Directory Specification 0.8).
 *
 * @param environment - the process environment (APPDATA, XDG_CONFIG_HOME)
 * @param platform - process.platform
 * @param homeFolder - os.homedir()
 * @returns an absolute folder path ending in "chelation-ledger"
 * @example userConfigFolder({}, 'linux', '/home/ab') === '/home/ab/.config/chelation-ledger'
 */
export function userConfigFolder(environment: Readonly<Record<string, string | undefined>>, platform: string, homeFolder: string): string {
  if (platform === 'win32') return join(environment['APPDATA'] || join(homeFolder, 'AppData', 'Roaming'), appFolderName);
  if (platform === 'darwin') return join(homeFolder, 'Library', 'Application Support', appFolderName);
  const xdg = environment['XDG_CONFIG_HOME'];
  // The XDG specification: a relative XDG_CONFIG_HOME is invalid and ignored.
  return join(xdg && xdg.startsWith('/') ? xdg : join(homeFolder, '.config'), appFolderName);
}
