import { IsOptional } from 'class-validator';
import { CalendarDay } from '../../../activity/dto/calendar-day';

export class SendDigestDto {
  @IsOptional()
  @CalendarDay('must be a calendar date written YYYY-MM-DD, e.g. 2026-12-02 (leave it out for today, UTC)')
  date?: string;
}
