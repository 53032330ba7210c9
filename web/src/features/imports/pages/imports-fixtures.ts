import type {
  ImportJobStatus,
  ImportPreview,
  ImportProblemDetail,
  RevisionDetail,
  RevisionSummary,
} from '@sagline/common/api-types';

/** Answers of the import routes for the Halvercote Yard demo (product.md, invented). */
export const revision1: RevisionSummary = {
  id: 31,
  number: 1,
  label: 'Rev A, scheme design',
  uploadedBy: { id: 6, name: 'Kasimir Oduya' },
  createdAt: '2025-03-04T10:00:00.000Z',
  fileName: 'halvercote-yard.xlsx',
  fileType: 'xlsx',
  fileSize: 88_412,
  memberCount: 391,
  passCount: 377,
  failCount: 14,
  status: 'committed',
};

export const revision2: RevisionSummary = {
  ...revision1,
  id: 32,
  number: 2,
  label: 'Rev B, issued for permit',
  createdAt: '2025-03-11T15:20:00.000Z',
  failCount: 15,
  passCount: 376,
};

export const revision1Detail: RevisionDetail = {
  ...revision1,
  parseReport: {
    problems: [
      {
        severity: 'warning',
        code: 'REVIEWER_NOT_ON_TEAM',
        sheet: 'Members',
        row: 88,
        column: 'Reviewer (column U)',
        mark: 'L3-J12',
        value: 'old.reviewer@halvercote.example',
        message: 'old.reviewer@halvercote.example is not on the team; the member was kept without a reviewer.',
      },
    ],
    memberRows: 391,
    loadRows: 164,
  },
  diff: { against: null, added: 391, removed: 0, changed: 0, flips: 0, flipped: [] },
  limitSet: { id: 3, name: 'IBC 2021 + ACI 318-19' },
};

/** A 422 body: two fatal cells and one warning; nothing stored. */
export const rowsInvalidDetails: ImportProblemDetail[] = [
  {
    severity: 'error',
    code: 'NOT_A_NUMBER',
    sheet: 'Members',
    row: 14,
    column: 'I [10^6 mm^4] (column L)',
    mark: 'L1-B13',
    value: 'about 180',
    message: 'I must be a number (e.g. 186); write the value without words.',
  },
  {
    severity: 'error',
    code: 'POSITION_OUTSIDE',
    sheet: 'Loads',
    row: 7,
    column: 'Position [m] (column D)',
    mark: 'L1-G02',
    value: 9.5,
    message: 'The point load sits at 9.5 m, beyond the 7.2 m member; give a position from 0 to 7.2 m.',
  },
  {
    severity: 'warning',
    code: 'CAMBER_IGNORED',
    sheet: 'Members',
    row: 40,
    mark: 'L2-B05',
    value: null,
    message: 'Camber is given for a timber member; it is kept but not subtracted.',
  },
];

export const preview: ImportPreview = {
  draftId: 'draft-9f2',
  fileName: 'halvercote-yard-rev-b.xlsx',
  fileType: 'xlsx',
  fileSize: 88_500,
  unitSystem: 'SI',
  memberCount: 391,
  loadRowCount: 164,
  problems: [],
  fatal: false,
  diff: {
    against: { id: 31, number: 1, label: 'Rev A, scheme design' },
    added: [],
    removed: [],
    changed: [
      {
        mark: 'L1-B03',
        level: 'L1',
        category: 'floor',
        verdict: 'fail',
        verdictBefore: 'pass',
        maxUtilization: 8.6,
        changes: [
          { field: 'I', label: 'I', before: 186e-6, after: 18.6e-6, beforeText: '186 ×10⁶ mm⁴', afterText: '18.6 ×10⁶ mm⁴' },
        ],
      },
    ],
    flips: [{ mark: 'L1-B03', level: 'L1', from: 'pass', to: 'fail', governingCheck: 'L/240 total', maxUtilization: 8.6 }],
    unchanged: 390,
  },
  summary: { pass: 376, fail: 15, unchecked: 0 },
  limitSet: { id: 3, name: 'IBC 2021 + ACI 318-19' },
  createdAt: '2025-03-11T15:00:00.000Z',
  expiresAt: '2025-03-12T15:00:00.000Z',
};

export const job = (over: Partial<ImportJobStatus>): ImportJobStatus => ({
  jobId: 'job-5',
  kind: 'commit',
  state: 'running',
  progress: 0.4,
  step: 'Writing results',
  attempts: 1,
  createdAt: '2025-03-11T15:20:00.000Z',
  updatedAt: '2025-03-11T15:20:01.000Z',
  ...over,
});
