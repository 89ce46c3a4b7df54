/**
 * The main window's options. Each web preference is one item of the Electron
 * security checklist (electronjs.org/docs/latest/tutorial/security, numbered as
 * on that page): 2 no Node.js integration for remote content, 3 context
 * isolation, 4 process sandboxing, 6 webSecurity kept on, 8 no insecure
 * content, 9 no experimental features, 10 no enableBlinkFeatures, 11 no
 * <webview>. The defaults of Electron 45 already match most of them; they are
 * written out so a change of default or a careless edit shows in a test.
 */
export interface MainWindowOptions {
  readonly width: number;
  readonly height: number;
  readonly minWidth: number;
  readonly minHeight: number;
  readonly title: string;
  readonly show: boolean;
  readonly backgroundColor: string;
  readonly webPreferences: {
    readonly preload: string;
    readonly contextIsolation: true;
    readonly sandbox: true;
    readonly nodeIntegration: false;
    readonly nodeIntegrationInWorker: false;
    readonly nodeIntegrationInSubFrames: false;
    readonly webSecurity: true;
    readonly allowRunningInsecureContent: false;
    readonly experimentalFeatures: false;
    readonly webviewTag: false;
    readonly navigateOnDragDrop: false;
    readonly safeDialogs: true;
    readonly spellcheck: false;
  };
}

/**
 * @param preloadPath - the built preload (dist/preload/preload.cjs), absolute
 * @param title - the window title (the product name)
 */
export function mainWindowOptions(preloadPath: string, title: string): MainWindowOptions {
  return {
    width: 1280,
    height: 860,
    minWidth: 900,
    minHeight: 600,
    title,
    // Shown on 'ready-to-show', so the user never sees a blank frame.
    show: false,
    backgroundColor: '#ffffff',
    webPreferences: {
      preload: preloadPath,
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      nodeIntegrationInSubFrames: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      experimentalFeatures: false,
      webviewTag: false,
      navigateOnDragDrop: false,
      safeDialogs: true,
      // Spell-checking sends typed words to a dictionary service on some platforms: patient data stays here.
      spellcheck: false,
    },
  };
}
