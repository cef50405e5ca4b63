// Electron main process, kept thin: one window, the menu, native dialogs, and the host handlers
// from ipcHandlers.ts (which hold all the logic and know nothing of Electron).

import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { app, BrowserWindow, dialog, ipcMain, Menu, session, shell, type MenuItemConstructorOptions } from 'electron';
import { HOST_EVENT_MENU_COMMAND, HOST_EVENT_OPEN_REQUEST } from '../../shared-core/host';
import { createHostHandlers, exportRefusal, FILE_FILTERS, menuTemplate, OPEN_FILTERS, registerHostHandlers, trustedUrlChecker, verifiedPng, type DialogPort, type MenuSpec } from './ipcHandlers';
import { createOpenRequestQueue, leadingArgvEntries } from './openRequests';

const here = path.dirname(fileURLToPath(import.meta.url));
const rendererDir = path.join(here, '../renderer');
const preloadPath = path.join(here, '../preload/index.cjs');
const devServerUrl = process.env.ELECTRON_RENDERER_URL ?? null;

let mainWindow: BrowserWindow | null = null;

// Documents the OS asks us to open wait here until the window takes them (openRequests.ts holds the logic).
const openRequests = createOpenRequestQueue(() => mainWindow?.webContents.send(HOST_EVENT_OPEN_REQUEST));
const leadingEntries = leadingArgvEntries(process.defaultApp);
// One instance: a document opened while the app runs (Windows, Linux) arrives as the second instance's argv.
const isPrimaryInstance = app.requestSingleInstanceLock();
if (!isPrimaryInstance) app.quit();
app.on('second-instance', (_event, argv, workingDirectory) => {
  openRequests.addArgv(argv, { cwd: workingDirectory, leadingEntries });
  if (mainWindow) {
    if (mainWindow.isMinimized()) mainWindow.restore();
    mainWindow.focus();
  } else if (app.isReady()) createWindow();
});
openRequests.addArgv(process.argv, { cwd: process.cwd(), leadingEntries });
// macOS sends double-clicked documents as open-file, at launch even before 'ready'.
app.on('open-file', (event, filePath) => {
  event.preventDefault();
  openRequests.add(filePath);
  if (app.isReady() && !mainWindow) createWindow();
});

function electronDialogs(): DialogPort {
  return {
    async chooseOpenPath(purpose) {
      const options = { properties: ['openFile' as const], filters: [purpose ? OPEN_FILTERS[purpose] : FILE_FILTERS.chart, { name: 'All files', extensions: ['*'] }] };
      const result = mainWindow ? await dialog.showOpenDialog(mainWindow, options) : await dialog.showOpenDialog(options);
      return result.canceled || result.filePaths.length === 0 ? null : result.filePaths[0];
    },
    async chooseSavePath({ suggestedName, kind, folder }) {
      const options = { defaultPath: path.join(folder ?? app.getPath('documents'), suggestedName), filters: [FILE_FILTERS[kind]] };
      const result = mainWindow ? await dialog.showSaveDialog(mainWindow, options) : await dialog.showSaveDialog(options);
      return result.canceled || !result.filePath ? null : result.filePath;
    },
  };
}

function buildMenu(spec: MenuSpec[]): Menu {
  const send = (command: string) => mainWindow?.webContents.send(HOST_EVENT_MENU_COMMAND, { command });
  const template: MenuItemConstructorOptions[] = spec.map((menu) => ({
    label: menu.label,
    submenu: menu.items.map((item): MenuItemConstructorOptions => {
      if ('separator' in item) return { type: 'separator' };
      if ('role' in item) return { role: item.role };
      return { label: item.label, accelerator: item.accelerator, click: () => send(item.command) };
    }),
  }));
  return Menu.buildFromTemplate(template);
}

function createWindow(): void {
  mainWindow = new BrowserWindow({
    width: 1440,
    height: 900,
    minWidth: 1024,
    minHeight: 640,
    show: false,
    title: 'Tallyglyph',
    backgroundColor: '#f4f5f2',
    webPreferences: {
      preload: preloadPath,
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      webSecurity: true,
      spellcheck: false,
    },
  });
  mainWindow.once('ready-to-show', () => mainWindow?.show());
  mainWindow.webContents.on('did-finish-load', () => openRequests.windowReady());
  mainWindow.on('closed', () => {
    mainWindow = null;
    openRequests.windowGone();
  });
  if (devServerUrl) void mainWindow.loadURL(devServerUrl);
  else void mainWindow.loadFile(path.join(rendererDir, 'index.html'));
}

// The window shows only our own pages: links open in the system browser, navigation elsewhere is refused.
app.on('web-contents-created', (_event, contents) => {
  const trusted = trustedUrlChecker({ rendererDir, devServerUrl });
  const refuseUntrusted = (event: { preventDefault(): void }, url: string) => {
    // Refused unless proven ours: nothing between here and the check can let a navigation through.
    let allowed: boolean;
    try {
      allowed = trusted(url);
    } catch {
      allowed = false;
    }
    if (!allowed) event.preventDefault();
  };
  contents.on('will-navigate', refuseUntrusted);
  contents.on('will-redirect', refuseUntrusted);
  contents.on('will-attach-webview', (event) => event.preventDefault());
  // The page's beforeunload guard (unsaved changes) only cancels in Electron; ask here, and let the
  // window go when the designer chooses to discard.
  contents.on('will-prevent-unload', (event) => {
    const owner = BrowserWindow.fromWebContents(contents);
    const options = {
      type: 'question' as const,
      buttons: ['Discard changes', 'Keep editing'],
      defaultId: 1,
      cancelId: 1,
      message: 'The chart has unsaved changes.',
      detail: 'Close it anyway and lose them?',
    };
    const choice = owner ? dialog.showMessageBoxSync(owner, options) : dialog.showMessageBoxSync(options);
    if (choice === 0) event.preventDefault();
  });
  contents.setWindowOpenHandler(({ url }) => {
    if (url.startsWith('https:')) void shell.openExternal(url);
    return { action: 'deny' };
  });
});

app.whenReady().then(() => {
  if (!isPrimaryInstance) return;
  // The editor needs no camera, microphone, notifications, geolocation or anything else: refuse all.
  session.defaultSession.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  const handlers = createHostHandlers({
    dialogs: electronDialogs(),
    recentFile: path.join(app.getPath('userData'), 'recent.json'),
    checkExport: exportRefusal,
    buildPng: verifiedPng,
    openRequests,
  });
  registerHostHandlers(ipcMain, handlers, trustedUrlChecker({ rendererDir, devServerUrl }));
  Menu.setApplicationMenu(buildMenu(menuTemplate({ isMac: process.platform === 'darwin', devTools: !app.isPackaged })));
  createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) createWindow();
  });
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
