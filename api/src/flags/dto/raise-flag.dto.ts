import type { RaiseFlagRequest } from '@sagline/common/api-types';
import { Mark, RaiseFields } from './flag-fields';

export class RaiseFlagDto extends RaiseFields implements RaiseFlagRequest {
  @Mark()
  mark: string;
}
