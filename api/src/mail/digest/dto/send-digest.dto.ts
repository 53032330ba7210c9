import { IsOptional, Matches } from 'class-validator';

export class SendDigestDto {
  @IsOptional()
  @Matches(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, { message: 'must be a calendar date written YYYY-MM-DD, e.g. 2026-12-02 (leave it out for today, UTC)' })
  date?: string;
}
