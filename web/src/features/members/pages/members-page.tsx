import { ComingSoon } from '@/components/coming-soon';

export function MembersPage() {
  return (
    <ComingSoon
      title="Members"
      summary="Every beam, joist, girder, lintel and cantilever of the latest schedule revision, with its deflection checks."
      points={[
        'A table filtered on the server by floor, category, reviewer, check and utilisation.',
        'Each member: a drawing with supports and loads, the elastic curve of each combination, and each load’s signed contribution at the governing point.',
        'The checks table with the limit’s source, and the moment of inertia that would pass next to every failure.',
        'Raise a flag on a member and assign it to an engineer.',
      ]}
    />
  );
}
