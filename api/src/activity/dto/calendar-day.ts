import { registerDecorator, type ValidationOptions } from 'class-validator';

/** True for a real calendar day written YYYY-MM-DD (2026-02-29 and 2026-13-01 are not). */
export function isCalendarDay(value: unknown): value is string {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

export const CALENDAR_DAY_MESSAGE = 'must be a calendar date written YYYY-MM-DD, e.g. 2026-12-02';

/** A day filter or parameter: a real calendar date, YYYY-MM-DD. */
export function CalendarDay(message: string = CALENDAR_DAY_MESSAGE, options: ValidationOptions = {}) {
  return (target: object, propertyName: string) =>
    registerDecorator({
      name: 'isCalendarDay',
      target: target.constructor,
      propertyName,
      options: { message, ...options },
      validator: { validate: (value: unknown) => isCalendarDay(value) },
    });
}
