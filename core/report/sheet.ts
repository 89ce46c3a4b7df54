import type { Chart } from './chart';

/**
 * The review sheet as pure data: what is printed, in order, with every number
 * already written as text. The PDF writer (app/host/sheetPdf.ts) lays it out
 * and the screen's preview can render the same data, so the two never differ.
 */

/** Printed on every page of the sheet (house rule: prominent cautions on every sheet page). */
export const sheetCaution =
  'Decision support only, not a prescription. Every value here is an estimate with stated uncertainty. The prescriber and local protocols decide; for review by the prescriber. Verify each value against the record before acting on it.';

/** Paper sizes the sheet is laid out for. */
export const sheetPapers = ['a4', 'letter'] as const;
export type SheetPaper = (typeof sheetPapers)[number];

export interface SheetHeader {
  readonly title: string;
  readonly caseLabel: string;
  readonly reviewDate: string;
  /** Who prepared the sheet, or null when not given. */
  readonly preparedBy: string | null;
  /** 'chelation-ledger 0.1.0'. */
  readonly toolVersion: string;
  /** SHA-256 of the case file's bytes as read, hex, so a printed sheet can be matched to its file. */
  readonly caseFileSha256: string;
  /** Patient line: label, age, weight, diagnosis group. */
  readonly patientLine: string;
  /** How the date is named where it is printed; default 'Review date' (a course plan prints its first day). */
  readonly dateLabel?: string;
  /** What the hash is of, where it is printed; default 'case file SHA-256' (a course plan prints its own). */
  readonly hashLabel?: string;
}

export interface SheetColumn {
  readonly title: string;
  readonly align: 'left' | 'right';
  /** '*' for the column that takes the width left over; otherwise sized to its content. */
  readonly width?: '*';
  /** True for cells that must stay on one line (a value with its band). */
  readonly noWrap?: boolean;
}

export type SheetBlock =
  | { readonly kind: 'paragraph'; readonly text: string; readonly style: 'body' | 'note' | 'caution' | 'small' }
  | { readonly kind: 'facts'; readonly rows: readonly { readonly label: string; readonly value: string }[] }
  | {
      readonly kind: 'table';
      readonly id: string;
      readonly caption: string;
      readonly columns: readonly SheetColumn[];
      readonly rows: readonly (readonly string[])[];
      /** A totals row, printed bold under the rows. */
      readonly totals?: readonly string[];
      /** Printed instead of an empty table. */
      readonly emptyText: string;
      readonly note?: string;
    }
  | { readonly kind: 'chart'; readonly chart: Chart; readonly caption: string }
  | {
      readonly kind: 'findings';
      readonly items: readonly {
        readonly severity: string;
        readonly title: string;
        readonly text: string;
        readonly sources: readonly string[];
        readonly sourceUncertain: boolean;
      }[];
      readonly emptyText: string;
    };

export interface SheetSection {
  readonly id: string;
  readonly title: string;
  /** True where the section begins a new page (the charts, the tables, the appendix). */
  readonly startsOnNewPage: boolean;
  readonly blocks: readonly SheetBlock[];
}

export interface SheetSignOff {
  /** Filled from the case file's sign-off when it has one; null leaves a line to write on. */
  readonly reviewedBy: string | null;
  readonly date: string | null;
  readonly comments: string | null;
  /** The case's review notes, 'date, by: text'. */
  readonly notes: readonly string[];
  /** Lines left blank for the prescriber. */
  readonly prescriberFields: readonly string[];
}

export interface Sheet {
  readonly header: SheetHeader;
  readonly caution: string;
  readonly sections: readonly SheetSection[];
  readonly signOff: SheetSignOff;
}
