import { z } from 'zod';
import type { CustomIssueParams } from './bounds';
import type { IsoDate } from '../dates';
import { describeCaseDateProblem, isCaseDate } from './caseDate';

/** A calendar date 'YYYY-MM-DD'; a missing date is reported as required, a wrong one as 'invalid_date'. */
export const isoDateSchema = z.custom<IsoDate>(isCaseDate, {
  error: (problem) =>
    problem.input === undefined ? 'is missing; expected a date YYYY-MM-DD.' : describeCaseDateProblem(problem.input),
  params: { code: 'invalid_date' } satisfies CustomIssueParams,
}).meta({ type: 'string', format: 'date', description: 'a calendar date YYYY-MM-DD' });

/** Identifier of an entry, unique within the case (the journal and the screens refer to entries by it). */
export const entryIdSchema = z.string().min(1).max(64);

/** Text a person typed that must not be empty (a name of a regimen, a reason, a reviewer). */
export const requiredTextSchema = (maxLength: number) => z.string().min(1).max(maxLength);

/** Free text that may be empty (a note). */
export const noteSchema = z.string().max(4000);
