/**
 * Addresses of the files the Imports screen offers for download. They are
 * plain links (the browser saves them: the API answers with
 * Content-Disposition: attachment), not fetches, so they live apart from the
 * SWR hooks.
 */
type Id = number | string;

export const templateHref = (projectId: Id) => `/api/projects/${projectId}/imports/template`;

export const exampleHref = (projectId: Id) => `/api/projects/${projectId}/imports/example`;

/** The uploaded file of a revision, byte for byte. */
export const revisionFileHref = (projectId: Id, revisionId: number) =>
  `/api/projects/${projectId}/revisions/${revisionId}/file`;

/** The results workbook of a revision (verdicts of every member and check). */
export const resultsWorkbookHref = (projectId: Id, revisionId: number) =>
  `/api/projects/${projectId}/revisions/${revisionId}/results.xlsx`;
