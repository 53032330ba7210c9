import { ValidationPipe, type ArgumentMetadata, type ValidationError } from '@nestjs/common';
import { LRUCache } from 'lru-cache';
import type { ApiErrorDetail } from '@sagline/common/api-types';
import { ApiError } from './api-error';

/**
 * The global pipe: DTOs validate, unknown fields are refused (not silently
 * dropped), values are transformed to the DTO's types. Failures become
 * 400 VALIDATION_FAILED with one detail per problem, `path` like `body.email`.
 */
export class ApiValidationPipe extends ValidationPipe {
  /**
   * Query strings already validated, per DTO class: a screen asks for the same few addresses again
   * and again, and validating one costs more than answering it from the read cache. Only values
   * that passed are kept (a bad query is checked, and refused, every time).
   */
  private readonly queries = new WeakMap<object, LRUCache<string, object>>();

  constructor() {
    super({
      whitelist: true,
      forbidNonWhitelisted: true,
      transform: true,
      forbidUnknownValues: true,
      // Values are needed to tell a missing field from a wrong one; they never reach the client.
      validationError: { target: false, value: true },
      exceptionFactory: (errors: ValidationError[]) => validationFailed(flatten(errors, '')),
    });
  }

  override async transform(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    // A body that is not a JSON object (an array, a string) cannot fill a DTO.
    if (metadata.type === 'body' && metadata.metatype && isDto(metadata.metatype) && (value === null || typeof value !== 'object' || Array.isArray(value))) {
      const message = value === undefined
        ? 'is missing: send a JSON object with the header Content-Type: application/json'
        : 'must be a JSON object';
      throw validationFailed([{ path: 'body', message }]);
    }
    // Route parameters typed as numbers are left to their own pipe (ParseIdPipe), which names them in its error.
    if (metadata.type === 'param' && !isDto(metadata.metatype)) return value;
    if (metadata.type === 'query' && metadata.metatype && isDto(metadata.metatype) && value && typeof value === 'object') {
      let seen = this.queries.get(metadata.metatype);
      if (!seen) this.queries.set(metadata.metatype, (seen = new LRUCache<string, object>({ max: 1_000 })));
      const key = JSON.stringify(value);
      const hit = seen.get(key);
      // A copy: whoever receives it may change its own query object.
      if (hit) return Object.assign(Object.create(Object.getPrototypeOf(hit) as object) as object, hit);
      const valid = (await this.checked(value, metadata)) as object;
      seen.set(key, Object.assign(Object.create(Object.getPrototypeOf(valid) as object) as object, valid));
      return valid;
    }
    return this.checked(value, metadata);
  }

  private async checked(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    try {
      return await super.transform(value ?? {}, metadata);
    } catch (e) {
      if (e instanceof ApiError && e.details) {
        const prefix = metadata.type === 'custom' ? 'value' : metadata.type;
        throw validationFailed(e.details.map((d) => ({ ...d, path: d.path ? `${prefix}.${d.path}` : prefix })));
      }
      throw e;
    }
  }
}

function isDto(metatype: unknown): boolean {
  return typeof metatype === 'function' && ![String, Number, Boolean, Array, Object].includes(metatype as never);
}

function validationFailed(details: ApiErrorDetail[]): ApiError {
  const summary = details.map((d) => `${d.path}: ${d.message}`).join('; ');
  return new ApiError('VALIDATION_FAILED', `Some fields need fixing: ${summary}`, details);
}

function flatten(errors: ValidationError[], parent: string): ApiErrorDetail[] {
  const out: ApiErrorDetail[] = [];
  for (const error of errors) {
    const path = parent ? `${parent}.${error.property}` : error.property;
    const constraints = Object.entries(error.constraints ?? {});
    if (constraints.length) {
      // One problem per field: "is required" when it is missing, else the rule written first
      // in the DTO (class-validator reports decorators bottom-up, so that is the last one here).
      const [rule, message] = constraints[constraints.length - 1];
      out.push({
        path,
        message:
          rule === 'whitelistValidation' ? 'is not a field of this request; remove it'
          : error.value === undefined || error.value === null ? 'is required'
          : message,
      });
    }
    if (error.children?.length) out.push(...flatten(error.children, path));
  }
  return out;
}
