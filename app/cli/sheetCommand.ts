import { buildSheet } from '../../core/report/buildSheet';
import { sheetPapers, type Sheet, type SheetPaper } from '../../core/report/sheet';
import { formatIssues, type Result } from '../../core/result';
import { writeFileAtomic } from '../host/atomicWrite';
import { sha256OfFile } from '../host/contentHash';
import type { SheetPdfOptions } from '../host/sheetPdf';
import { toolVersion } from '../host/toolVersion';
import type { ParsedArgs } from './args';
import { reviewCase, type CaseIo } from './caseReview';
import { decisionSupportCaution } from './format';
import { exitCodes } from './io';

/** What the sheet command needs beyond reading a case: the content hash, the PDF writer and a file writer. Tests pass fakes. */
export interface SheetHostIo {
  readonly hashCaseFile: (path: string) => Result<string>;
  readonly renderSheet: (sheet: Sheet, options: SheetPdfOptions) => Promise<Buffer>;
  readonly writeSheet: (path: string, bytes: Uint8Array, options: { readonly overwrite: boolean }) => Promise<Result<void>>;
}

export const sheetUsage = `Usage:
  chelation-ledger sheet <case.json> -o review.pdf [--paper a4|letter] [--as-of YYYY-MM-DD] [--prepared-by NAME] [--force]
Writes the review sheet as a PDF: summary, charts, record tables, method appendix and sign-off, with the
caution on every page. An existing file is not replaced unless --force is given.`;

const sheetOnlyOptions = ['--output', '--paper', '--prepared-by'] as const;

/**
 * `sheet <case.json> -o review.pdf [--paper a4|letter] [--as-of DATE] [--prepared-by NAME] [--force]`:
 * compute the review, build the sheet (core/report) and write it as a PDF, atomically.
 */
export async function sheetCommand(args: ParsedArgs, io: CaseIo & Partial<SheetHostIo>): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(sheetUsage);
    return exitCodes.ok;
  }
  const problems: string[] = [];
  const positionals: string[] = [];
  let shortOutput: string | undefined;
  for (let index = 0; index < args.positionals.length; index += 1) {
    const word = args.positionals[index]!;
    if (word === '-o') {
      shortOutput = args.positionals[index + 1];
      if (shortOutput === undefined) problems.push('-o: a file name is missing after the flag.');
      index += 1;
    } else {
      positionals.push(word);
    }
  }
  const output = shortOutput ?? args.options['--output'];
  const paperText = args.options['--paper'] ?? 'a4';
  const preparedBy = args.options['--prepared-by'];
  if (positionals.length === 0 || (output === undefined && problems.length === 0)) {
    io.err(sheetUsage);
    return exitCodes.usage;
  }
  if (!(sheetPapers as readonly string[]).includes(paperText)) problems.push(`--paper: "${paperText}" is not a paper size of the sheet (a4 or letter).`);
  if (preparedBy !== undefined && (preparedBy.trim() === '' || preparedBy.length > 100 || /[\u0000-\u001f]/.test(preparedBy))) {
    problems.push(`--prepared-by: "${preparedBy}" is not a name of 1–100 printable characters.`);
  }
  if (output !== undefined && !/\.pdf$/i.test(output)) problems.push(`-o: "${output}" does not end in .pdf; the sheet is written as a PDF.`);
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  // The shared review path checks the case and --as-of; it does not know the sheet's own options.
  const reviewArgs: ParsedArgs = {
    ...args,
    positionals,
    options: Object.fromEntries(Object.entries(args.options).filter(([flag]) => !(sheetOnlyOptions as readonly string[]).includes(flag))),
    // --force is the sheet's own switch (replace an existing PDF); the review path refuses switches it does not know.
    switches: new Set([...args.switches].filter((flag) => flag !== '--force')),
  };
  const review = await reviewCase(reviewArgs, io, { command: 'sheet', usage: sheetUsage });
  if (typeof review === 'number') return review;
  if (review.warnings.length > 0) io.err(formatIssues(review.warnings));
  const casePath = positionals[0]!;
  const hash = (io.hashCaseFile ?? sha256OfFile)(casePath);
  if (!hash.ok) {
    io.err(formatIssues(hash.issues));
    return exitCodes.invalidInput;
  }
  const sheet = buildSheet({
    caseFile: review.caseFile,
    results: review.results,
    findings: review.findings,
    caseFileSha256: hash.value,
    toolVersion,
    preparedBy: preparedBy?.trim() ?? null,
  });
  const paper = paperText as SheetPaper;
  // The PDF library loads only when a sheet is written, so the other commands start fast.
  const render = io.renderSheet ?? (await import('../host/sheetPdf')).writeSheetPdf;
  const bytes = await render(sheet, { paper });
  const written = await (io.writeSheet ?? ((path, data, options) => writeFileAtomic(path, data, options)))(output!, bytes, { overwrite: args.switches.has('--force') });
  if (!written.ok) {
    io.err(formatIssues(written.issues));
    return exitCodes.invalidInput;
  }
  if (written.warnings && written.warnings.length > 0) io.err(formatIssues(written.warnings));
  io.out(`Wrote the review sheet of ${sheet.header.caseLabel} (review date ${sheet.header.reviewDate}, ${paper === 'a4' ? 'A4' : 'Letter'}) to ${output}.`);
  io.out(`Case file SHA-256 ${hash.value}.`);
  io.out(decisionSupportCaution);
  return exitCodes.ok;
}
