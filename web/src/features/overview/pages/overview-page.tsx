import { ComingSoon } from '@/components/coming-soon';

export function OverviewPage() {
  return (
    <ComingSoon
      title="Overview"
      summary="Where the project stands, for the manager who has to see every raised item closed before drawings are issued."
      points={[
        'Per floor: members passing and failing, flags open and closed.',
        'Per reviewer: what each checker has reviewed and what is still waiting.',
        'A closure chart over time, and the overdue flags to chase.',
      ]}
    />
  );
}
