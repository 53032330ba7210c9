/**
 * Addresses of workbooks to take away. Plain links (the API answers with
 * Content-Disposition: attachment, the browser saves the file), not fetches.
 */
type Id = number | string;

/** Every flag of the project (GET /api/projects/:projectId/flags.xlsx). */
export const flagsWorkbookHref = (projectId: Id) => `/api/projects/${projectId}/flags.xlsx`;
