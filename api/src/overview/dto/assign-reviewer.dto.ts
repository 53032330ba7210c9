import { ArrayMaxSize, ArrayMinSize, IsArray, IsInt, IsNotEmpty, IsString, MaxLength, Min, ValidateIf } from 'class-validator';
import { FLAG_LIMITS, OVERVIEW_LIMITS, type AssignLevelReviewerRequest, type AssignMemberReviewersRequest } from '@sagline/common/api-types';

const REVIEWER = 'must be the user id of a checker on this project, or null to remove the assignment';

export class AssignLevelReviewerDto implements AssignLevelReviewerRequest {
  // Required, but null (remove) is a value.
  @ValidateIf((_, v) => v !== null)
  @Min(1, { message: REVIEWER })
  @IsInt({ message: REVIEWER })
  reviewerId: number | null;
}

export class AssignMemberReviewersDto implements AssignMemberReviewersRequest {
  @IsArray({ message: 'must be a list of marks, e.g. ["B1", "B2"]' })
  @ArrayMinSize(1, { message: 'must name at least one mark' })
  @ArrayMaxSize(OVERVIEW_LIMITS.marksMax, { message: `may name at most ${OVERVIEW_LIMITS.marksMax} marks per request` })
  @IsString({ each: true, message: 'each mark must be text, e.g. "B12"' })
  @IsNotEmpty({ each: true, message: 'each mark must be the mark of a member, e.g. "B12"' })
  @MaxLength(FLAG_LIMITS.markMax, { each: true, message: `each mark must be at most ${FLAG_LIMITS.markMax} characters` })
  marks: string[];

  @ValidateIf((_, v) => v !== null)
  @Min(1, { message: REVIEWER })
  @IsInt({ message: REVIEWER })
  reviewerId: number | null;
}
