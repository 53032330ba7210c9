import { Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import { ApiError } from '../common/api-error';

/** 403 FORBIDDEN unless the signed-in person is an admin (runs after SignedInGuard). */
@Injectable()
export class AdminGuard implements CanActivate {
  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (!req.user?.isAdmin) throw new ApiError('FORBIDDEN', 'Only an admin can do this; ask an admin of your firm.');
    return true;
  }
}
