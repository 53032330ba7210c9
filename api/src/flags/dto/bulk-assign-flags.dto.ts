import { ArrayMaxSize, ArrayMinSize, ArrayUnique, IsArray, IsInt, Min, ValidateIf } from 'class-validator';
import { FLAG_LIMITS, type BulkAssignFlagsRequest } from '@sagline/common/api-types';
import { DueDate } from './flag-fields';

export class BulkAssignFlagsDto implements BulkAssignFlagsRequest {
  @IsArray({ message: 'must be a list of flag ids, e.g. [12, 14]' })
  @ArrayMinSize(1, { message: 'must name at least one flag' })
  @ArrayMaxSize(FLAG_LIMITS.bulkAssignMax, { message: `may name at most ${FLAG_LIMITS.bulkAssignMax} flags per request` })
  @IsInt({ each: true, message: 'each flag id must be a whole number' })
  @Min(1, { each: true, message: 'each flag id must be 1 or more' })
  @ArrayUnique({ message: 'names a flag twice' })
  flagIds: number[];

  // Required, but null (unassign) is a value.
  @ValidateIf((_, v) => v !== null)
  @IsInt({ message: 'must be the user id of an engineer on this project, or null to unassign' })
  @Min(1, { message: 'must be the user id of an engineer on this project, or null to unassign' })
  assigneeId: number | null;

  @DueDate()
  dueDate?: string | null;
}
