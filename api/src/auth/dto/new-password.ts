import { applyDecorators } from '@nestjs/common';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { LIMITS } from '@sagline/common/api-types';

/**
 * A password someone chooses (changing theirs, accepting an invitation):
 * text of LIMITS.passwordMin to LIMITS.passwordMax characters, with the same
 * wording everywhere. The decorators are applied in the order class-validator
 * would apply them written one above the other (IsString on top), so the
 * one problem reported for a field is the same: "must be text" first.
 */
export const IsNewPassword = () =>
  applyDecorators(
    MaxLength(LIMITS.passwordMax, { message: `must be at most ${LIMITS.passwordMax} characters` }),
    MinLength(LIMITS.passwordMin, { message: `must be at least ${LIMITS.passwordMin} characters` }),
    IsString({ message: 'must be text' }),
  );
