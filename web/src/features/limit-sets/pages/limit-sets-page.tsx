import { ComingSoon } from '@/components/coming-soon';

export function LimitSetsPage() {
  return (
    <ComingSoon
      title="Limit sets"
      summary="The serviceability limits this project checks against, each traced to its published source."
      points={[
        'Rows of member category × check: a load combination (L, D+L, …), a span ratio (360, 240, …) and an optional absolute cap.',
        'Every row names its source: standard, edition and table.',
        'Start from a preset that ships with its source, then copy and edit it for the project.',
      ]}
    />
  );
}
