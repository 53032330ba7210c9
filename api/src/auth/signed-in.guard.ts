import { Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import { ApiError } from '../common/api-error';

/** 401 UNAUTHENTICATED unless the request carries a signed-in session. */
@Injectable()
export class SignedInGuard implements CanActivate {
  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (!req.user) throw new ApiError('UNAUTHENTICATED', 'You are not signed in (or your session ended); sign in and try again.');
    return true;
  }
}
