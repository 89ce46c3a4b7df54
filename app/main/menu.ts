import type { MenuCommand } from '../../core/contract/callNames';

/** A menu item as Electron's Menu.buildFromTemplate takes it (the fields used here). */
export interface MenuItemTemplate {
  readonly label?: string;
  readonly role?: 'quit' | 'about' | 'undo' | 'redo' | 'cut' | 'copy' | 'paste' | 'selectAll' | 'reload' | 'toggleDevTools' | 'togglefullscreen' | 'zoomIn' | 'zoomOut' | 'resetZoom' | 'windowMenu' | 'appMenu';
  readonly type?: 'separator';
  readonly accelerator?: string;
  readonly click?: () => void;
  readonly submenu?: readonly MenuItemTemplate[];
}

export interface MenuActions {
  /** Tell the page a command (it runs it through the host contract). */
  readonly send: (command: MenuCommand) => void;
  readonly print: () => void;
  readonly about: () => void;
}

/**
 * The application menu: File (Open…, Save, Export sheet…, Print…, Quit),
 * Edit (the platform's editing roles, so copy and paste work in fields) and
 * Help (About). Open, Save and Export go to the page, which owns the work
 * being edited; Print and About are the window's.
 *
 * @param platform - process.platform; macOS keeps Quit in the app menu
 */
export function applicationMenu(actions: MenuActions, platform: string): MenuItemTemplate[] {
  const mac = platform === 'darwin';
  const file: MenuItemTemplate = {
    label: 'File',
    submenu: [
      { label: 'Open…', accelerator: 'CmdOrCtrl+O', click: () => actions.send('open') },
      { label: 'Save', accelerator: 'CmdOrCtrl+S', click: () => actions.send('save') },
      { label: 'Export sheet…', accelerator: 'CmdOrCtrl+E', click: () => actions.send('export-sheet') },
      { type: 'separator' },
      { label: 'Print…', accelerator: 'CmdOrCtrl+P', click: actions.print },
      ...(mac ? [] : [{ type: 'separator' as const }, { label: 'Quit', role: 'quit' as const, accelerator: 'CmdOrCtrl+Q' }]),
    ],
  };
  const edit: MenuItemTemplate = {
    label: 'Edit',
    submenu: [{ role: 'undo' }, { role: 'redo' }, { type: 'separator' }, { role: 'cut' }, { role: 'copy' }, { role: 'paste' }, { role: 'selectAll' }],
  };
  const help: MenuItemTemplate = { label: 'Help', submenu: [{ label: 'About chelation-ledger', click: actions.about }] };
  return mac ? [{ role: 'appMenu' }, file, edit, help] : [file, edit, help];
}

/** The About box's text: name, version and the caution every screen carries. */
export function aboutText(name: string, version: string): string {
  return `${name} ${version}\n\nDecision support for chelation therapy reviews. Every figure is for review by the prescriber; follow local protocols. It does not prescribe.`;
}
