/**
 * Files the Members screen offers for download: plain links (the API answers
 * with Content-Disposition: attachment), not fetches.
 */
export const resultsWorkbookHref = (projectId: number | string, revisionId: number) =>
  `/api/projects/${projectId}/revisions/${revisionId}/results.xlsx`;
