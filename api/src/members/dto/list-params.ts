import { applyDecorators } from '@nestjs/common';
import { Transform, Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsIn, IsNumber, IsOptional, IsString, Matches, MaxLength, Min } from 'class-validator';

// Inside applyDecorators the rule listed LAST is reported when several fail, so the basic one goes last.

/** Longest comma-separated list a filter takes (more is a mistake, not a filter). */
export const LIST_MAX = 200;

/**
 * Splits `a,b` (and repeated `?x=a&x=b`) into trimmed, non-empty strings, so
 * list filters arrive as string[] whatever way the client wrote them.
 */
export function splitList(value: unknown, commas = true): unknown {
  const parts = Array.isArray(value) ? value : [value];
  if (parts.some((p) => typeof p !== 'string')) return value;
  return (parts as string[]).flatMap((p) => (commas ? p.split(',') : [p])).map((p) => p.trim()).filter((p) => p !== '');
}

/**
 * A list of short texts: comma-separated codes, or (`commas: false`, for
 * check names, which may hold commas) one value per repeated parameter.
 */
export const TextList = (example: string, options: { commas?: boolean } = {}) =>
  applyDecorators(
    IsOptional(),
    Transform(({ value }) => splitList(value, options.commas ?? true)),
    MaxLength(120, { each: true, message: 'each value must be at most 120 characters' }),
    ArrayMaxSize(LIST_MAX, { message: `may list at most ${LIST_MAX} values` }),
    IsString({ each: true, message: `must be a list of texts, e.g. ${example}` }),
    IsArray({ message: `must be a list of texts, e.g. ${example}` }),
  );

/** A comma-separated list of ids; `extra` words (e.g. `none`, `me`) are allowed beside them. */
export const IdList = (what: string, extra: string[] = []) => {
  const words = extra.length ? `|${extra.join('|')}` : '';
  const hint = `${what} ids${extra.length ? ` or ${extra.map((w) => `"${w}"`).join(', ')}` : ''}, comma-separated, e.g. 3,4`;
  return applyDecorators(
    IsOptional(),
    Transform(({ value }) => splitList(value)),
    ArrayMaxSize(LIST_MAX, { message: `may list at most ${LIST_MAX} values` }),
    Matches(new RegExp(`^([1-9]\\d{0,9}${words})$`), { each: true, message: `must be ${hint}` }),
    IsArray({ message: `must be ${hint}` }),
  );
};

/** A utilisation bound (1 = at the limit). */
export const Utilization = () =>
  applyDecorators(
    IsOptional(),
    Type(() => Number),
    IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'must be a number of 0 or more, e.g. 0.9 (1 = at the limit)' }),
    Min(0, { message: 'must be a number of 0 or more, e.g. 0.9 (1 = at the limit)' }),
  );

/** Ids among `values` as numbers, and whether any of `word` was given. */
export function idsAnd(values: string[] | undefined, word: string): { ids: number[]; word: boolean } {
  const list = values ?? [];
  return { ids: list.filter((v) => v !== word && /^\d+$/.test(v)).map(Number), word: list.includes(word) };
}

export const SearchText = (max: number) =>
  applyDecorators(IsOptional(), Transform(({ value }) => (typeof value === 'string' ? value.trim() : value)), MaxLength(max, { message: `must be at most ${max} characters` }), IsString({ message: 'must be text' }));

/** A comma-separated list of words from `allowed`. */
export const WordList = (allowed: readonly string[]) =>
  applyDecorators(
    IsOptional(),
    Transform(({ value }) => splitList(value)),
    IsArray({ message: `must be one or more of ${allowed.join(', ')}, comma-separated` }),
    IsIn(allowed, { each: true, message: `must be one or more of ${allowed.join(', ')}, comma-separated` }),
  );
