import { Transform } from 'class-transformer';
import { applyDecorators } from '@nestjs/common';
import { ArrayMaxSize, ArrayMinSize, ArrayUnique, IsArray, IsIn, IsNotEmpty, IsString, MaxLength } from 'class-validator';
import { LIMITS, UNIT_SYSTEMS } from '@sagline/common/api-types';
import { Trim } from '../../common/dto-helpers';

/** Field rules shared by create and update, with the numbers from common/api-types LIMITS. */
export const ProjectName = () =>
  applyDecorators(
    Trim(),
    IsString({ message: 'must be text' }),
    IsNotEmpty({ message: 'is required, e.g. "Halvercote Yard"' }),
    MaxLength(LIMITS.projectNameMax, { message: `must be at most ${LIMITS.projectNameMax} characters` }),
  );

export const ProjectNumber = () =>
  applyDecorators(
    Trim(),
    IsString({ message: 'must be text' }),
    IsNotEmpty({ message: 'is required: the firm\'s project number, e.g. "HY-2026"' }),
    MaxLength(LIMITS.projectNumberMax, { message: `must be at most ${LIMITS.projectNumberMax} characters` }),
  );

export const UnitSystemField = () => IsIn(UNIT_SYSTEMS, { message: `must be one of ${UNIT_SYSTEMS.join(', ')}` });

export const LevelNames = () =>
  applyDecorators(
    Transform(({ value }) => (Array.isArray(value) ? value.map((v) => (typeof v === 'string' ? v.trim() : v)) : value)),
    IsArray({ message: 'must be a list of level names, bottom to top, e.g. ["L1", "L2", "Roof"]' }),
    ArrayMinSize(1, { message: 'must name at least one level' }),
    ArrayMaxSize(LIMITS.levelsMax, { message: `must have at most ${LIMITS.levelsMax} levels` }),
    IsString({ each: true, message: 'each level name must be text' }),
    IsNotEmpty({ each: true, message: 'level names cannot be empty' }),
    MaxLength(LIMITS.levelNameMax, { each: true, message: `each level name must be at most ${LIMITS.levelNameMax} characters` }),
    ArrayUnique((v: unknown) => (typeof v === 'string' ? v.toLowerCase() : v), { message: 'names a level twice (names are compared ignoring case)' }),
  );
