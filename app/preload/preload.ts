// The desktop app's preload, built to one CommonJS file (dist/preload/preload.cjs):
// a sandboxed preload cannot require its own other files (stack-notes.md). It
// imports only the call names from the contract, not its schemas.
import { contextBridge, ipcRenderer } from 'electron';
import { exposedHostGlobal } from '../../core/contract/callNames';
import { buildExposedApi } from './exposedApi';

contextBridge.exposeInMainWorld(exposedHostGlobal, buildExposedApi(ipcRenderer));
