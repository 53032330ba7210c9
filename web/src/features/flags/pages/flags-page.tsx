import { ComingSoon } from '@/components/coming-soon';

export function FlagsPage() {
  return (
    <ComingSoon
      title="Flags"
      summary="Members raised for action by a checker, tracked until they are closed."
      points={[
        'A table and a status board: open, answered, closed, or waived with a reason.',
        'Each flag has an owner, a due date, comments and its history.',
        'When a new revision changes a flagged member, its checks run again and the flag says so.',
      ]}
    />
  );
}
