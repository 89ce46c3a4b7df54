import type { Result } from '../core/result';

/**
 * What the workspace asks of its host: the case store and the exports. The
 * Electron preload and the preview server implement it through the host
 * contract (renderer/host, core/contract); renderer/fakeHost/memoryHost.ts
 * implements it in the page for tests and for a build served without a host.
 * Case files travel as JSON values; the renderer parses them with core/model.
 */
export interface StoredCase {
  /** The store's id of the case (a file name in the case folder). */
  readonly id: string;
  /** The case file as stored (parsed by the renderer with core/model parseCase). */
  readonly json: unknown;
}

export interface ExportReceipt {
  /** Where the host wrote the file, as the user would find it. */
  readonly location: string;
  readonly bytes: number;
}

export interface WorkspaceHost {
  /** A short name of the transport, shown in the about box ('in-page store', 'desktop', 'preview'). */
  readonly kind: string;
  listCases(): Promise<Result<readonly StoredCase[]>>;
  saveCase(id: string, json: unknown): Promise<Result<{ readonly id: string }>>;
  /** A new case id from a label (the host decides the file name). */
  createCase(json: unknown): Promise<Result<{ readonly id: string }>>;
  /** Import a case file's text; the host stores it and returns its id. */
  importCase(text: string): Promise<Result<{ readonly id: string }>>;
  exportSheet(id: string, asOf: string): Promise<Result<ExportReceipt>>;
  exportCalendar(id: string, asOf: string): Promise<Result<ExportReceipt>>;
}
