import { Transform, Type } from 'class-transformer';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsNotEmpty, IsObject, IsOptional, IsString, MaxLength, ValidateNested } from 'class-validator';
import { FLAG_LIMITS, type BulkRaiseFlagsRequest } from '@sagline/common/api-types';
import { MemberFilterFields } from '../../members/dto/list-members.dto';
import { RaiseFields } from './flag-fields';

export class BulkRaiseFlagsDto extends RaiseFields implements BulkRaiseFlagsRequest {
  @IsOptional()
  @Transform(({ value }) => (Array.isArray(value) ? value.map((v) => (typeof v === 'string' ? v.trim() : v)) : value))
  @IsArray({ message: 'must be a list of marks, e.g. ["B12", "B14"]' })
  @ArrayMinSize(1, { message: 'must name at least one mark (or send a filter instead)' })
  @ArrayMaxSize(FLAG_LIMITS.bulkMax, { message: `may name at most ${FLAG_LIMITS.bulkMax} marks per request` })
  @IsString({ each: true, message: 'each mark must be text' })
  @IsNotEmpty({ each: true, message: 'marks cannot be empty' })
  @MaxLength(FLAG_LIMITS.markMax, { each: true, message: `each mark must be at most ${FLAG_LIMITS.markMax} characters` })
  marks?: string[];

  @IsOptional()
  @IsObject({ message: 'must be an object of Members filters, e.g. { "level": "3", "check": "L/360 live" }' })
  @ValidateNested()
  @Type(() => MemberFilterFields)
  filter?: MemberFilterFields;
}
