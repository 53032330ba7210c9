import type { CreateProjectRequest, UnitSystem } from '@sagline/common/api-types';
import { LevelNames, ProjectName, ProjectNumber, UnitSystemField } from './project-fields';

export class CreateProjectDto implements CreateProjectRequest {
  @ProjectName()
  name: string;

  @ProjectNumber()
  number: string;

  @UnitSystemField()
  unitSystem: UnitSystem;

  @LevelNames()
  levels: string[];
}
