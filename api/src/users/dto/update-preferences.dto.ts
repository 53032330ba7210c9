import { IsBoolean } from 'class-validator';

export class UpdatePreferencesDto {
  @IsBoolean({ message: 'must be true (send me the daily digest) or false (no digest)' })
  digest!: boolean;
}
