import { IsIn } from 'class-validator';
import { PROJECT_ROLES, type ChangeRoleRequest, type ProjectRole } from '@sagline/common/api-types';

export class ChangeRoleDto implements ChangeRoleRequest {
  @IsIn(PROJECT_ROLES, { message: `must be one of ${PROJECT_ROLES.join(', ')}` })
  role: ProjectRole;
}
