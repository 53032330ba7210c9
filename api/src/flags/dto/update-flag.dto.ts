import type { UpdateFlagRequest } from '@sagline/common/api-types';
import { DueDate, PersonId, Version } from './flag-fields';

export class UpdateFlagDto implements UpdateFlagRequest {
  @Version()
  version: number;

  @PersonId()
  assigneeId?: number | null;

  @DueDate()
  dueDate?: string | null;
}
