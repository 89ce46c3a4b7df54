/**
 * The names of the calls the renderer may make to its host, and nothing else.
 *
 * Kept apart from the schemas (contract.ts) and free of imports so that the
 * Electron preload, which is bundled into one small sandboxed file, can expose
 * exactly these calls without carrying zod or the case model with it
 * (stack-notes.md, "A sandboxed preload cannot require its own other files").
 */
export const hostCallNames = [
  'appInfo',
  'currentWorkspace',
  'chooseWorkspace',
  'listCases',
  'openCase',
  'createCase',
  'saveCase',
  'saveCaseAs',
  'renameCase',
  'archiveCase',
  'recoverCase',
  'importDryRun',
  'importCommit',
  'workProgress',
  'cancelWork',
  'exportSheetPdf',
  'exportCalendar',
  'readSettings',
  'writeSettings',
  'takeOpenRequest',
] as const;

export type HostCallName = (typeof hostCallNames)[number];

/**
 * Commands the main process sends to the page: the desktop menu's File ▸ Open,
 * Save and Export sheet, and `open-requested` when the operating system asked
 * the app to open a case file (the page then takes the request through
 * `takeOpenRequest`, once it has nothing unsaved). A command is a word only;
 * what it concerns crosses through the contract's validated calls.
 */
export const menuCommands = ['open', 'save', 'export-sheet', 'open-requested'] as const;
export type MenuCommand = (typeof menuCommands)[number];

/**
 * The global name under which the preload exposes the host calls. The
 * renderer's host client reads it; nothing else in the renderer names it.
 */
export const exposedHostGlobal = 'chelationLedgerHost';

/** The IPC channel of one call; only app/main and app/preload use channel strings. */
export function channelOf(name: HostCallName): string {
  return `host:${name}`;
}

/** The channel on which the main process sends menu commands to the page. */
export const menuChannel = 'host-event:menu';

/** True when a string is one of the call names (for the transports' routing). */
export function isHostCallName(value: unknown): value is HostCallName {
  return typeof value === 'string' && (hostCallNames as readonly string[]).includes(value);
}
