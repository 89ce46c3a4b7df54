/**
 * How the browser preview carries the contract over HTTP (app/preview serves
 * it, renderer/host calls it); kept here so the two ends cannot disagree.
 */

/** Name of the page-URL parameter carrying the preview's per-run token. */
export const previewTokenParameter = 'token';
/** Header each call carries the token in (a header, not a cookie, so another site's page cannot send it). */
export const previewTokenHeader = 'x-chelation-ledger-token';
/** Path under which the preview answers the contract: POST `/api/<call name>` with the request as JSON. */
export const previewApiPath = '/api/';
