import { IsOptional } from 'class-validator';
import type { UnitSystem, UpdateProjectRequest } from '@sagline/common/api-types';
import { LevelNames, ProjectName, ProjectNumber, UnitSystemField } from './project-fields';

export class UpdateProjectDto implements UpdateProjectRequest {
  @IsOptional()
  @ProjectName()
  name?: string;

  @IsOptional()
  @ProjectNumber()
  number?: string;

  @IsOptional()
  @UnitSystemField()
  unitSystem?: UnitSystem;

  @IsOptional()
  @LevelNames()
  levels?: string[];
}
