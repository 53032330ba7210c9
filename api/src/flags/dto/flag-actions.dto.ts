import type { AnswerFlagRequest, CloseFlagRequest, CommentFlagRequest, ReopenFlagRequest, WaiveFlagRequest } from '@sagline/common/api-types';
import { OptionalBody, RequiredBody, Version } from './flag-fields';

export class AnswerFlagDto implements AnswerFlagRequest {
  @Version()
  version: number;

  @RequiredBody('the answer, e.g. "Changed to W14x30, I = 291 in⁴"')
  body: string;
}

export class CloseFlagDto implements CloseFlagRequest {
  @Version()
  version: number;

  @OptionalBody()
  body?: string;
}

export class ReopenFlagDto implements ReopenFlagRequest {
  @Version()
  version: number;

  @RequiredBody('say why the flag is reopened')
  body: string;
}

export class WaiveFlagDto implements WaiveFlagRequest {
  @Version()
  version: number;

  @RequiredBody('say why the flag is waived (e.g. "accepted by the engineer of record, see RFI 14")')
  reason: string;
}

export class CommentFlagDto implements CommentFlagRequest {
  @RequiredBody('the comment')
  body: string;
}
