import type { RaiseFlagRequest } from '@sagline/common/api-types';
import { CheckName, DueDate, Mark, OptionalBody, PersonId, Title } from './flag-fields';

export class RaiseFlagDto implements RaiseFlagRequest {
  @Mark()
  mark: string;

  @CheckName()
  checkName?: string | null;

  @Title()
  title?: string;

  @OptionalBody()
  comment?: string;

  @PersonId()
  assigneeId?: number | null;

  @DueDate()
  dueDate?: string | null;
}
