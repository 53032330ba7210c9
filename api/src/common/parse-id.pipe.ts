import { Injectable, type ArgumentMetadata, type PipeTransform } from '@nestjs/common';
import { invalidField } from './api-error';

/** A positive integer id from a route parameter, or 400 naming the parameter. */
@Injectable()
export class ParseIdPipe implements PipeTransform<string, number> {
  transform(value: string, metadata: ArgumentMetadata): number {
    if (!/^[1-9]\d{0,9}$/.test(value) || Number(value) > 2_147_483_647) {
      throw invalidField(`params.${metadata.data ?? 'id'}`, `must be a positive whole number (got "${value}")`);
    }
    return Number(value);
  }
}
