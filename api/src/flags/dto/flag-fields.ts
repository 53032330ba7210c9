import { applyDecorators } from '@nestjs/common';
import { IsInt, IsISO8601, IsNotEmpty, IsOptional, IsString, Matches, MaxLength, Min } from 'class-validator';
import { FLAG_LIMITS } from '@sagline/common/api-types';
import { Trim } from '../../common/dto-helpers';

/**
 * Field rules of the flag requests, with the numbers from common/api-types
 * FLAG_LIMITS. Inside applyDecorators the rule listed LAST is the one
 * reported when several fail (see common/validation.ts), so the most basic
 * rule (must be text, the format) comes last.
 */

export const Version = () =>
  applyDecorators(
    IsInt({ message: "must be the flag's version as you last loaded it (a whole number)" }),
    Min(1, { message: "must be the flag's version as you last loaded it (1 or more)" }),
  );

/** Required text (answer, reopen comment, waive reason, comment). */
export const RequiredBody = (what: string) =>
  applyDecorators(
    Trim(),
    MaxLength(FLAG_LIMITS.bodyMax, { message: `must be at most ${FLAG_LIMITS.bodyMax} characters` }),
    IsNotEmpty({ message: `is required: ${what}` }),
    IsString({ message: 'must be text' }),
  );

export const OptionalBody = () =>
  applyDecorators(
    IsOptional(),
    Trim(),
    MaxLength(FLAG_LIMITS.bodyMax, { message: `must be at most ${FLAG_LIMITS.bodyMax} characters` }),
    IsString({ message: 'must be text' }),
  );

export const Title = () =>
  applyDecorators(
    IsOptional(),
    Trim(),
    MaxLength(FLAG_LIMITS.titleMax, { message: `must be at most ${FLAG_LIMITS.titleMax} characters` }),
    IsNotEmpty({ message: 'cannot be empty (leave it out for the default title)' }),
    IsString({ message: 'must be text' }),
  );

export const Mark = () =>
  applyDecorators(
    Trim(),
    MaxLength(FLAG_LIMITS.markMax, { message: `must be at most ${FLAG_LIMITS.markMax} characters` }),
    IsNotEmpty({ message: 'is required: the mark of a member, e.g. "B12"' }),
    IsString({ message: 'must be text: the mark of a member, e.g. "B12"' }),
  );

/** A check name, or null / left out for the member as a whole. */
export const CheckName = () =>
  applyDecorators(
    IsOptional(),
    Trim(),
    MaxLength(FLAG_LIMITS.checkNameMax, { message: `must be at most ${FLAG_LIMITS.checkNameMax} characters` }),
    IsNotEmpty({ message: 'cannot be empty (send null for the member as a whole)' }),
    IsString({ message: 'must be text: one of the member\'s checks, e.g. "L/360 live" (or null for the member as a whole)' }),
  );

/** A person's id, or null (nobody). Left out: no change. */
export const PersonId = () =>
  applyDecorators(
    IsOptional(),
    IsInt({ message: 'must be the user id of an engineer on this project, or null' }),
    Min(1, { message: 'must be the user id of an engineer on this project, or null' }),
  );

/** A calendar date "YYYY-MM-DD", or null (none). Left out: no change. */
export const DueDate = () =>
  applyDecorators(
    IsOptional(),
    IsISO8601({ strict: true }, { message: 'is not a date of the calendar (check the month and the day)' }),
    Matches(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be a date written YYYY-MM-DD, e.g. 2026-12-18, or null' }),
    IsString({ message: 'must be a date written YYYY-MM-DD, e.g. 2026-12-18, or null' }),
  );

/** What a raise says of the flags it makes, whether for one mark or many (RaiseFlagRequest, BulkRaiseFlagsRequest). */
export class RaiseFields {
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
