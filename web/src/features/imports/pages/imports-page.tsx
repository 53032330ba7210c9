import { ComingSoon } from '@/components/coming-soon';

export function ImportsPage() {
  return (
    <ComingSoon
      title="Imports"
      summary="Upload a member schedule, see the validation report and the diff, and commit it as a revision."
      points={[
        'Upload the schedule as xlsx or csv; download the blank template to start one.',
        'A validation report naming the row, the column and what is wrong; nothing is stored while anything is fatal.',
        'What changed against the last revision: added, removed and changed members, and verdicts that flipped.',
        'Commit it as the next revision, with a label; every revision keeps its original file.',
      ]}
    />
  );
}
